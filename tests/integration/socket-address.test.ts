import { spawn, type ChildProcess } from "node:child_process";
import { connect } from "node:net";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

// scripts/lib/socket-address.mjs, preloaded as scripts/serve.mjs preloads it into `next start`, in
// front of a plain server that answers with the headers it was given. A client may send the header
// under any spelling, more than once: what reaches the server must be the socket's peer, always.
const hook = fileURLToPath(new URL("../../scripts/lib/socket-address.mjs", import.meta.url));
const echoServer = `
  const http = require("node:http");
  const server = http.createServer((req, res) => res.end(JSON.stringify({ headers: req.headers, rawHeaders: req.rawHeaders })));
  server.listen(0, "127.0.0.1", () => console.log(server.address().port));
`;

let server: ChildProcess;
let port: number;

beforeAll(async () => {
  server = spawn(process.execPath, ["--import", hook, "-e", echoServer], { stdio: ["ignore", "pipe", "inherit"] });
  port = await new Promise<number>((resolve) => server.stdout!.once("data", (chunk: Buffer) => resolve(Number(chunk.toString().trim()))));
});

afterAll(() => {
  server.kill();
});

/** Sends raw HTTP/1.1 (so header spellings and repeats go out exactly as written) and returns the echo. */
function rawRequest(headerLines: string[]): Promise<{ headers: Record<string, string>; rawHeaders: string[] }> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, "127.0.0.1", () => socket.write([`GET / HTTP/1.1`, `Host: arcwright.test`, ...headerLines, "Connection: close", "", ""].join("\r\n")));
    let answer = "";
    socket.on("data", (chunk) => (answer += chunk.toString()));
    socket.on("end", () => resolve(JSON.parse(answer.slice(answer.indexOf("\r\n\r\n") + 4))));
    socket.on("error", reject);
  });
}

describe("the client address header cannot be forged", () => {
  it("is the socket's peer when the client sends none", async () => {
    const { headers } = await rawRequest([]);
    expect(headers["x-arcwright-socket-address"]).toBe("127.0.0.1");
  });

  it("replaces a forged one, in any spelling and repeated, in both header views", async () => {
    const { headers, rawHeaders } = await rawRequest(["X-Arcwright-Socket-Address: 6.6.6.6", "x-arcwright-socket-address: 7.7.7.7", "X-ARCWRIGHT-SOCKET-ADDRESS: 8.8.8.8", "X-Forwarded-For: 9.9.9.9"]);
    expect(headers["x-arcwright-socket-address"]).toBe("127.0.0.1");
    const names = rawHeaders.filter((_, i) => i % 2 === 0).map((name) => name.toLowerCase());
    expect(names.filter((name) => name === "x-arcwright-socket-address")).toHaveLength(1);
    expect(rawHeaders.join("\n")).not.toMatch(/6\.6\.6\.6|7\.7\.7\.7|8\.8\.8\.8/);
    // X-Forwarded-For is passed on untouched; the app believes it only from a trusted proxy.
    expect(headers["x-forwarded-for"]).toBe("9.9.9.9");
  });
});

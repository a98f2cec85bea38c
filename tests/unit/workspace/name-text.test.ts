import { describe, expect, it } from "vitest";
import { accountSchema } from "@/lib/auth/schemas";
import { createNoteSchema } from "@/lib/workspace/note-schema";
import { createProposalSchema } from "@/lib/workspace/proposal-schema";
import { nameText } from "@/lib/workspace/stored-text";

// Names are one line (CWE-93, CWE-117): a line break in a name makes another line of a list, a mail
// or a log look like an entry of its own.
describe("names refuse line breaks, tabs and other control characters", () => {
  it.each([
    ["CR/LF", "Ada\r\nBcc: everyone@example.org"],
    ["LF", "Ada\nQuillon"],
    ["tab", "Ada\tQuillon"],
    ["DEL", "Ada\u007f"],
    ["C1 next line", "Ada\u0085Quillon"],
    ["line separator", "Ada\u2028Quillon"],
  ])("%s", (_, name) => {
    const result = nameText("The target name").safeParse(name);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toBe("The target name is one line: it cannot contain line breaks, tabs or other control characters.");
  });

  it("as a field error on the person's name and the proposal's title, while an abstract and a note keep their newlines", () => {
    const account = accountSchema.safeParse({ email: "ada@example.org", name: "Ada\r\nQuillon", password: "long-enough-pass" });
    expect(account.error?.issues.map((i) => i.path.join("."))).toEqual(["name"]);
    const proposal = {
      title: "Arcs\nover the bulge",
      cycle: "2033A",
      abstract: "First line.\nSecond line.",
      site: { name: "Mesa Lucerna Station", latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 },
      instrument: { resolutionMas: 50, cadenceHours: 12, campaignLengthDays: 90 },
    };
    expect(createProposalSchema.safeParse(proposal).error?.issues.map((i) => i.path.join("."))).toEqual(["title"]);
    expect(createProposalSchema.safeParse({ ...proposal, title: "Arcs over the bulge" }).success).toBe(true);
    expect(createNoteSchema.safeParse({ body: "Line one.\r\nLine two.\tTabbed." }).success).toBe(true);
  });

  it("keeps names with other Unicode (accents, right-to-left marks, emoji)", () => {
    for (const name of ["Åsa Lindqvist", "Zoë d’Arcy", "\u200fمرصد", "🔭 Team"]) expect(nameText("The target name").safeParse(name).success, name).toBe(true);
  });
});

// The load run's request mix and its autocannon instances: one instance per request kind and member,
// so every connection carries one member's session and every answer is counted under its kind.

/** The target table's page size (components/targets/target-table-state.ts). */
const pageSizeRows = 50;
/** Computed columns the table sorts by on the server (lib/workspace/target-query.ts). */
const computedSortColumns = ["einsteinRadiusMas", "imageSeparationMas", "magnificationTotal", "timeDelayDays", "crossingTimeDays"];
/** A request that takes longer than this counts as an error (autocannon's own default). */
const requestTimeoutSeconds = 10;

const pickOf = (items) => items[Math.floor(Math.random() * items.length)];
const between = (low, high) => low + (high - low) * Math.random();

/**
 * The kinds of request, each with its share of the connections, who sends it and how the next one is
 * made. Co-Is and the PI write; the viewer only reads.
 * @param {{ proposalId: string, targetIds: string[] }} seed
 */
export function requestKinds({ proposalId, targetIds }) {
  const pageCount = Math.ceil(targetIds.length / pageSizeRows);
  const targetPath = () => `/api/proposals/${proposalId}/targets/${pickOf(targetIds)}`;
  let noteSerial = 0;
  return [
    {
      name: "read",
      label: "GET target list page",
      share: 0.7,
      isWrite: false,
      next: () => {
        const query = new URLSearchParams({
          page: String(1 + Math.floor(Math.random() * pageCount)),
          pageSize: String(pageSizeRows),
          sort: pickOf(computedSortColumns),
          direction: pickOf(["asc", "desc"]),
        });
        return { method: "GET", path: `/api/proposals/${proposalId}/targets?${query}` };
      },
    },
    {
      name: "edit",
      label: "PATCH target field",
      share: 0.2,
      isWrite: true,
      next: () => {
        const change = Math.random() < 0.5 ? { priority: 1 + Math.floor(Math.random() * 5) } : { sourceOffsetThetaE: Number(between(0.05, 1.4).toFixed(3)) };
        return { method: "PATCH", path: targetPath(), body: JSON.stringify(change) };
      },
    },
    {
      name: "note",
      label: "POST note",
      share: 0.1,
      isWrite: true,
      next: () => {
        noteSerial += 1;
        const body = `Load-run note ${noteSerial}: seeing ${between(0.5, 1.4).toFixed(2)}″, baseline checked.`;
        return { method: "POST", path: `${targetPath()}/notes`, body: JSON.stringify({ body }) };
      },
    },
  ];
}

/** Splits `total` connections over the kinds by share, at least one each. */
function connectionsByKind(kinds, total) {
  if (total < kinds.length) throw new Error(`--connections must be at least ${kinds.length} (one per request kind)`);
  const counts = kinds.map((kind) => Math.max(1, Math.round(total * kind.share)));
  counts[0] += total - counts.reduce((sum, n) => sum + n, 0);
  return counts;
}

/** `count` connections dealt round-robin over `members`; members dealt none are left out. */
function dealConnections(count, members) {
  const dealt = members.map((member, i) => ({ member, connections: Math.floor(count / members.length) + (i < count % members.length ? 1 : 0) }));
  return dealt.filter((d) => d.connections > 0);
}

/** Headers every request of a member carries: its session and the app's own origin, as a browser page's. */
const memberHeaders = (appUrl, member, isWrite) => ({
  Origin: appUrl,
  Cookie: member.cookie,
  Accept: "application/json",
  ...(isWrite ? { "Content-Type": "application/json" } : {}),
});

/**
 * Sends one request of every kind as every member allowed it and throws unless each answers 2xx, so a
 * broken request shape fails before the timed run instead of as 60 s of errors. It also loads each
 * route's code in the server before the clock starts.
 */
export async function preflight(appUrl, kinds, members) {
  for (const kind of kinds) {
    for (const member of members.filter((m) => !kind.isWrite || m.role !== "viewer")) {
      const { method, path, body } = kind.next();
      const response = await fetch(`${appUrl}${path}`, { method, body, headers: memberHeaders(appUrl, member, kind.isWrite) });
      const text = await response.text();
      if (!response.ok) throw new Error(`preflight ${kind.name} as ${member.role} ${member.email}: ${method} ${path} answered ${response.status}: ${text.slice(0, 300)}`);
    }
  }
}

/**
 * Runs the mix for `durationSeconds` with `totalConnections` connections and hands every answer to
 * `recorder` (kind, status, latency in ms, bytes) and every failed request to `recorder.error`.
 * Connections send back to back unless `requestsPerSecondPerConnection` paces them (a person at a
 * page rather than a script). `onStart` receives a stop function (for Ctrl-C).
 *
 * A paced connection is an autocannon instance of its own, started at a random moment within its
 * first period: autocannon paces a connection by a timer started with it, so connections started
 * together would all send in the same instant every period, a burst no team of people makes.
 */
export async function runMix({ appUrl, kinds, members, durationSeconds, totalConnections, requestsPerSecondPerConnection, recorder, onStart }) {
  // Loaded here, not at the top: the load run imports this module before `npm ci` has installed it.
  const { default: autocannon } = await import("autocannon");
  const instances = [];
  /** Paced connections still waiting for their moment to start. */
  const starts = [];
  let isStopped = false;
  const launch = (kind, member, connections) => {
    const instance = autocannon({
      url: appUrl,
      connections,
      duration: durationSeconds,
      timeout: requestTimeoutSeconds,
      ...(requestsPerSecondPerConnection ? { connectionRate: requestsPerSecondPerConnection } : {}),
      headers: memberHeaders(appUrl, member, kind.isWrite),
      requests: [
        {
          setupRequest: (request) => ({ ...request, ...kind.next() }),
          onResponse: (status, body) => {
            if (status < 200 || status >= 300) recorder.sample(kind.name, `${status} as ${member.role}: ${String(body).slice(0, 200)}`);
          },
        },
      ],
    });
    instance.on("response", (_client, status, bytes, latencyMs) => recorder.response(kind.name, status, latencyMs, bytes));
    instance.on("reqError", (error) => recorder.error(kind.name, error));
    instances.push(instance);
    return instance;
  };
  const periodMs = requestsPerSecondPerConnection ? 1000 / requestsPerSecondPerConnection : 0;
  connectionsByKind(kinds, totalConnections).forEach((count, k) => {
    const kind = kinds[k];
    const senders = members.filter((m) => !kind.isWrite || m.role !== "viewer");
    for (const { member, connections } of dealConnections(count, senders)) {
      if (periodMs === 0) {
        launch(kind, member, connections);
        continue;
      }
      for (let c = 0; c < connections; c++) {
        starts.push(
          new Promise((resolve) => setTimeout(resolve, Math.random() * periodMs)).then(() => (isStopped ? undefined : launch(kind, member, 1))),
        );
      }
    }
  });
  onStart?.(() => {
    isStopped = true;
    instances.forEach((instance) => instance.stop());
  });
  const startedAt = performance.now();
  await Promise.all(starts);
  await Promise.all(instances);
  return { elapsedSeconds: (performance.now() - startedAt) / 1000, instanceCount: instances.length };
}

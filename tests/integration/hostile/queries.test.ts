import { acceptedBodyOf, describeEveryEndpoint } from "../support/hostile-endpoints";
import { hostileQueryText } from "../support/hostile-input";
import { catchMailDuringFile } from "../support/mail-catcher";

catchMailDuringFile();

describeEveryEndpoint("hostile query strings: never a 5xx, every refusal in the documented shape, 400s name their fields, a refusal writes nothing", {
  // Endpoints that read no query string get a few runs, to show they ignore one.
  numRuns: (endpoint) => (endpoint.query ? 30 : 4),
  input: (endpoint, world) => hostileQueryText(endpoint.query?.(world) ?? {}),
  parts: (endpoint, world, query) => ({ params: endpoint.params(world), query, body: acceptedBodyOf(endpoint, world) }),
});

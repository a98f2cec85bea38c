import { acceptedQueryOf, describeEveryEndpoint } from "../support/hostile-endpoints";
import { hostileBodyText } from "../support/hostile-input";
import { catchMailDuringFile } from "../support/mail-catcher";

catchMailDuringFile();

describeEveryEndpoint("hostile request bodies: never a 5xx, every refusal in the documented shape, 400s name their fields, a refusal writes nothing", {
  // Endpoints that read no body get a few runs, to show they ignore one.
  numRuns: (endpoint) => (endpoint.body ? 40 : 4),
  input: (endpoint, world) => hostileBodyText(endpoint.body?.(world)),
  parts: (endpoint, world, body) => ({ params: endpoint.params(world), query: acceptedQueryOf(endpoint, world), body }),
  checkTemplates: true,
});

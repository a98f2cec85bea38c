// Season view speed: 1,000 targets over a 183-night cycle from one site, against the 2 s target of
// the sky-windows issue. Prints figures only; never passes or fails on timing.
import { seasonWindows } from "@/lib/astro/season";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { bestSeconds, fibonacciSky } from "../lib/bench-sky";

const TARGET_SECONDS = 2;
const TARGET_COUNT = 1000;
const NIGHT_COUNT = 183;
const site = { name: "Bench site", latitudeDeg: -24.6, longitudeEastDeg: -70.4, elevationM: 2600, horizonLimitDeg: 15 };

const targets = fibonacciSky(TARGET_COUNT);

// One untimed run warms the JIT, as a worker that has served a request before would be.
seasonWindows({ site, targets: targets.slice(0, 10), startNightIso: "2027-04-01", nightCount: 10 });
let observable = 0;
const seasonSeconds = bestSeconds(() => {
  const season = seasonWindows({ site, targets, startNightIso: "2027-04-01", nightCount: NIGHT_COUNT });
  observable = season.targets.filter((target) => !target.isNeverObservable).length;
}, 3);
const nightSeconds = bestSeconds(() => nightlyVisibility(site, targets[500], "2027-06-15"), 5);

console.log(`season: ${TARGET_COUNT} targets × ${NIGHT_COUNT} nights in ${seasonSeconds.toFixed(3)} s (best of 3); ` +
  `target ${TARGET_SECONDS} s; ratio ${(seasonSeconds / TARGET_SECONDS).toFixed(3)} of the target; ${observable} targets observable`);
console.log(`one night chart (Moon at every 5-minute sample): ${(nightSeconds * 1000).toFixed(1)} ms`);

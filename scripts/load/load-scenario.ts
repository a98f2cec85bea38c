/**
 * The invented scenario of the load run: one survey proposal with 1,000 lens candidates and a team of
 * five. Nothing here names a real team, observatory, survey or object; the numbers are plausible, not
 * measured. A fixed pseudo-random sequence makes every run seed the same targets.
 */
import type { ProposalRole } from "@/lib/workspace/roles";
import type { TargetStatus } from "@/lib/workspace/status";
import type { CreateTargetInput } from "@/lib/workspace/target-schema";

export interface LoadMember {
  email: string;
  name: string;
  password: string;
  role: ProposalRole;
}

/** The team; the passwords guard only a throwaway database that lives for one run. */
export const loadMembers: LoadMember[] = [
  { email: "mara.ostrander@corvid-ridge.example", name: "Mara Ostrander", password: "ostrander-load-arcs", role: "pi" },
  { email: "jun.halloway@corvid-ridge.example", name: "Jun Halloway", password: "halloway-load-arcs", role: "coi" },
  { email: "aino.feldspar@corvid-ridge.example", name: "Aino Feldspar", password: "feldspar-load-arcs", role: "coi" },
  { email: "rafe.mbeki@corvid-ridge.example", name: "Rafe Mbeki", password: "mbeki-load-arcs", role: "coi" },
  { email: "lotte.sandoval@corvid-ridge.example", name: "Lotte Sandoval", password: "sandoval-load-arcs", role: "viewer" },
];

export const loadProposal = {
  title: "Corvid Ridge lens census: a thousand candidates",
  cycle: "2032B",
  abstract:
    "A census of stellar microlensing candidates toward the bulge and galaxy-scale lens candidates across the southern sky, ranked for adaptive-optics follow-up.",
  site: { name: "Corvid Ridge Observatory", latitudeDeg: -29.26, longitudeDeg: -70.73, elevationM: 2400, horizonLimitDeg: 20 },
  instrument: { resolutionMas: 50, cadenceHours: 6, campaignLengthDays: 120 },
};

const loadTargetCount = 1000;
/** One target in this many is a galaxy-scale (isothermal) lens; the rest are stellar lenses in the bulge. */
const galaxyEvery = 5;

/** mulberry32: a small, fast 32-bit generator; good enough to spread invented values, not for secrets. */
function generator(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

const round = (value: number, digits: number) => Number(value.toFixed(digits));

export interface LoadTarget {
  input: CreateTargetInput;
  status: TargetStatus;
}

/** The 1,000 targets, in the shape the API's create schema accepts (coordinates in degrees). */
export function loadTargets(): LoadTarget[] {
  const random = generator(20_320_801);
  const between = (low: number, high: number) => low + (high - low) * random();
  const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)];
  const statuses: TargetStatus[] = ["candidate", "candidate", "candidate", "accepted", "scheduled", "observed", "dropped"];
  const list: LoadTarget[] = [];
  for (let index = 0; index < loadTargetCount; index++) {
    const serial = String(index + 1).padStart(4, "0");
    const common = { priority: 1 + Math.floor(random() * 5), sourceOffsetThetaE: round(between(0.05, 1.4), 3) };
    const input: CreateTargetInput =
      index % galaxyEvery === 0
        ? (() => {
            const lensRedshift = round(between(0.1, 0.8), 3);
            return {
              ...common,
              name: `CRC-GL-${serial}`,
              ra: round(between(0, 360), 5),
              dec: round(between(-75, 25), 5),
              lensModel: "sis" as const,
              velocityDispersionKmPerS: round(between(150, 320), 1),
              lensRedshift,
              sourceRedshift: round(lensRedshift + between(0.3, 2.5), 3),
              tags: ["galaxy", pick(["double", "ring", "arc", "quad-candidate"])],
            };
          })()
        : (() => {
            const lensDistancePc = Math.round(between(1000, 7000));
            return {
              ...common,
              name: `CRC-ML-${serial}`,
              // The bulge window: right ascension 17h20m–18h20m, declination −36° to −22°.
              ra: round(between(260, 275), 5),
              dec: round(between(-36, -22), 5),
              lensModel: "point" as const,
              // Log-uniform from brown dwarfs to massive remnants.
              lensMassSolar: round(Math.exp(between(Math.log(0.05), Math.log(8))), 4),
              lensDistancePc,
              sourceDistancePc: Math.round(between(Math.max(7500, lensDistancePc + 500), 9500)),
              properMotionMasPerYr: round(between(1.5, 12), 2),
              tags: ["bulge", pick(["high-mag", "ao", "follow-up", "blended"])],
            };
          })();
    list.push({ input, status: pick(statuses) });
  }
  return list;
}

/** A few observing notes, written on the first targets before the run starts. */
export const loadNotes = [
  "Baseline flat over the first 30 nights; *rising* since night 31.",
  "Seeing 0.7″ on the last visit. Blend check against the archival frame shows no neighbour within 0.4″.",
  "Ask for the 2-hour cadence slot if the peak falls in dark time.",
];

/**
 * Invented proposals and targets for the bench ↔ proposal tests: two sites (one southern, one
 * northern), short cycles (45 nights, so the schedules stay cheap), and instruments from a seeing-limited
 * camera to a millimetre interferometer. Values are written with a few significant digits, as people
 * type them.
 */
import type { FeasibilitySettings } from "@/lib/workspace/derived";
import type { BenchTarget } from "@/lib/workspace/bench-link";

const southernRidge = { name: "Southern Ridge (invented)", latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200, horizonLimitDeg: 20 };
const northernPeak = { name: "Northern Peak (invented)", latitudeDeg: 28.76, longitudeDeg: -17.88, elevationM: 2396, horizonLimitDeg: 15 };

const camera = {
  resolutionMas: 50,
  cadenceHours: 24,
  campaignLengthDays: 90,
  airmassLimit: 2,
  interferometerWavelengthMm: null,
  interferometerBaselineKm: null,
  moonMinSeparationDeg: 30,
  moonMaxIllumination: null,
  visitMinutes: 20,
  clearNightFraction: 1,
  astrometricPrecisionMas: null,
  reachableContrast: null,
  // The bench sketches no orbiting star and carries no spectrograph: always unset here.
  spectroscopicPrecisionKmPerS: null,
};

/**
 * Proposals: each instrument and observing constraint appears set and unset somewhere; one has no
 * cycle. No photometry: the bench has no camera, so bench and proposal are compared without a photon budget.
 */
export const proposals: FeasibilitySettings[] = [
  { site: southernRidge, cycleStartDate: "2027-06-01", cycleEndDate: "2027-07-15", instrument: camera, photometry: null },
  {
    site: southernRidge,
    cycleStartDate: "2027-02-01",
    cycleEndDate: "2027-03-17",
    instrument: { ...camera, resolutionMas: 0.6, cadenceHours: 6, campaignLengthDays: 30, astrometricPrecisionMas: 0.05, reachableContrast: 100, moonMaxIllumination: 0.6, clearNightFraction: 0.7 },
    photometry: null,
  },
  {
    site: northernPeak,
    cycleStartDate: "2027-09-10",
    cycleEndDate: "2027-10-24",
    instrument: { ...camera, resolutionMas: 25, cadenceHours: 72, campaignLengthDays: 365, visitMinutes: 45, airmassLimit: 1.5, moonMinSeparationDeg: null, reachableContrast: 30 },
    photometry: null,
  },
  {
    site: northernPeak,
    cycleStartDate: "2027-04-01",
    cycleEndDate: "2027-05-15",
    instrument: { ...camera, resolutionMas: 1000, interferometerWavelengthMm: 1.3, interferometerBaselineKm: 10700, astrometricPrecisionMas: 0.005, cadenceHours: 12, campaignLengthDays: 45 },
    photometry: null,
  },
  {
    site: southernRidge,
    cycleStartDate: "2027-08-01",
    cycleEndDate: "2027-09-14",
    instrument: { ...camera, resolutionMas: 0.05, interferometerWavelengthMm: 0.0022, interferometerBaselineKm: 0.13, astrometricPrecisionMas: 0.2, reachableContrast: 1000, visitMinutes: 10, clearNightFraction: 0.5 },
    photometry: null,
  },
  { site: northernPeak, cycleStartDate: null, cycleEndDate: null, instrument: { ...camera, resolutionMas: 80, astrometricPrecisionMas: 0.1 }, photometry: null },
];

/** Target positions (ICRS degrees): the Galactic bulge, and fields up at other times of the year. */
export const positions = [
  { raDeg: 269.3, decDeg: -29.2 },
  { raDeg: 83.63, decDeg: 22.01 },
  { raDeg: 150.12, decDeg: 2.21 },
  { raDeg: 10.68, decDeg: 41.27 },
];

/** A point lens in the bulge with every target field set. */
export const fullPointTarget: BenchTarget = {
  lensModel: "point",
  lensMassSolar: 0.32,
  velocityDispersionKmPerS: null,
  lensDistancePc: 5200,
  sourceDistancePc: 8100,
  lensRedshift: null,
  sourceRedshift: null,
  sourceOffsetThetaE: 0.12,
  properMotionMasPerYr: 6.1,
  scienceCase: "photometric-microlensing",
  eventPeakJdUtc: 2461600.1875,
  sourceRadiusSolar: 1.4,
  sourceRadiusThetaE: null,
  limbDarkeningU: 0.55,
  raDeg: 269.3,
  decDeg: -29.2,
};

/** A galaxy-scale isothermal lens given by redshifts, ρ typed, the case inferred. */
export const fullSisTarget: BenchTarget = {
  lensModel: "sis",
  lensMassSolar: null,
  velocityDispersionKmPerS: 245,
  lensDistancePc: null,
  sourceDistancePc: null,
  lensRedshift: 0.42,
  sourceRedshift: 1.85,
  sourceOffsetThetaE: 0.35,
  properMotionMasPerYr: 2,
  scienceCase: null,
  eventPeakJdUtc: null,
  sourceRadiusSolar: null,
  sourceRadiusThetaE: 0.002,
  limbDarkeningU: null,
  raDeg: 150.12,
  decDeg: 2.21,
};

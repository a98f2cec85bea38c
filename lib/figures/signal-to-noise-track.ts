/**
 * What the schedule timeline's S/N track draws of a photon budget: each visit's S/N at its middle,
 * thinned to the lowest and the highest S/N per pixel column (a fine cadence places 10⁵ visits in a
 * cycle), and the axis range, logarithmic when the S/N spans more than a factor of ten.
 */

export interface SignalToNoiseMark {
  /** Middle of the visit, JD UTC. */
  jdUtc: number;
  signalToNoise: number;
  isBelowGoal: boolean;
  /** The visit's index in the budget's arrays. */
  visit: number;
}

/**
 * The marks of the visits starting at `visitsJdUtc` (JD UTC, ascending) lasting `visitLengthDays`,
 * with S/N `signalToNoise` (index-aligned) against `goal`: in each column `columnDays` wide (from
 * `originJdUtc`), the visit of lowest S/N and the one of highest (one mark when they are the same
 * visit), in time order; a column's lowest is its worst visit, so the budget's worst visit is always
 * drawn. A visit below the goal is one whose S/N is under it (strictly).
 */
export function signalToNoiseMarks(
  visitsJdUtc: ArrayLike<number>,
  visitLengthDays: number,
  signalToNoise: ArrayLike<number>,
  goal: number,
  columnDays: number,
  originJdUtc: number,
): SignalToNoiseMark[] {
  const marks: SignalToNoiseMark[] = [];
  const mark = (visit: number): SignalToNoiseMark => ({
    jdUtc: visitsJdUtc[visit] + visitLengthDays / 2,
    signalToNoise: signalToNoise[visit],
    isBelowGoal: signalToNoise[visit] < goal,
    visit,
  });
  let column = Number.NaN;
  let low = -1;
  let high = -1;
  const flush = () => {
    if (low < 0) return;
    const pair = low === high ? [low] : [Math.min(low, high), Math.max(low, high)];
    for (const visit of pair) marks.push(mark(visit));
  };
  for (let i = 0; i < visitsJdUtc.length; i++) {
    const at = Math.floor((visitsJdUtc[i] + visitLengthDays / 2 - originJdUtc) / columnDays);
    if (at !== column) {
      flush();
      column = at;
      low = i;
      high = i;
      continue;
    }
    if (signalToNoise[i] < signalToNoise[low]) low = i;
    if (signalToNoise[i] > signalToNoise[high]) high = i;
  }
  flush();
  return marks;
}

/**
 * The S/N axis: the values (positive, finite) and the goal, logarithmic with a margin when the highest
 * is over ten times the lowest (as the light curve's axis), else linear from 0.
 */
export function signalToNoiseAxis(signalToNoise: ArrayLike<number>, goal: number): { low: number; high: number; isLog: boolean } {
  let low = goal;
  let high = goal;
  for (let i = 0; i < signalToNoise.length; i++) {
    const value = signalToNoise[i];
    if (!(value > 0) || !Number.isFinite(value)) continue;
    low = Math.min(low, value);
    high = Math.max(high, value);
  }
  const isLog = high > 10 * low;
  return isLog ? { low: low / 1.3, high: high * 1.3, isLog } : { low: 0, high: high * 1.1, isLog };
}

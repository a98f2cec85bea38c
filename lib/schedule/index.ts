/** The simulated observing schedule: what pages, workers and verdicts import. */
export { observingSchedule, observingSchedules } from "./plan";
export { emptyScheduleMessage } from "./empty-reason";
export { isClearNight } from "./clear-nights";
export { placeVisits } from "./visits";
export { SEASON_BRIDGE_NIGHTS } from "./seasons";
export type { MoonConstraintInput, ScheduleConditions, ScheduleRequest, SchedulesRequest } from "./request";
export type { EmptyScheduleReason, ObservingSchedule, ObservingSeason, ScheduleGap, ScheduleGapReason, TimeSpanJd, VisitSky } from "./types";

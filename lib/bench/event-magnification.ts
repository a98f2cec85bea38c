/**
 * The magnification the bench draws for a microlensing event at lens–source offset u: the point-lens
 * images that are not behind the lens's body, with the total capped by the source's finite size.
 * Both are stated approximations: an image is taken as hidden or seen whole (its ray passes inside
 * or outside the body), and the cap is the uniform disk's peak (lib/physics/finite-source.ts).
 */

import { pointLensImages } from "@/lib/physics";
import { cappedMagnification } from "@/lib/physics/finite-source";
import type { MicrolensingEvent } from "./compute-results";

export interface EventMagnification {
  magnification: number;
  /** The source's size, not the offset, sets the value (the peak is "limited by the source's size"). */
  isCapped: boolean;
}

/** Magnification at offset `u` (θ_E, ≥ 0) of the event's source, as an observer sees it. */
export function eventMagnification(u: number, event: Pick<MicrolensingEvent, "sourceRadiusThetaE" | "occultingRadiusThetaE">): EventMagnification {
  const images = pointLensImages(u);
  const isPlusSeen = images.thetaPlus >= event.occultingRadiusThetaE;
  const isMinusSeen = Math.abs(images.thetaMinus) >= event.occultingRadiusThetaE;
  if (isPlusSeen && isMinusSeen) return cappedMagnification(u, event.sourceRadiusThetaE);
  const seen = (isPlusSeen ? images.magnificationPlus : 0) + (isMinusSeen ? Math.abs(images.magnificationMinus) : 0);
  const capped = cappedMagnification(u, event.sourceRadiusThetaE);
  return seen > capped.magnification ? capped : { magnification: seen, isCapped: false };
}

/**
 * The magnification the bench draws for a microlensing event at lens–source offset u: the source is
 * a disk of radius ρ, uniform or linearly limb-darkened (its finite-source magnification, lib/lensing),
 * or a point when no radius is set, and point-lens images
 * behind the lens's body are left out. Leaving an image out is a stated approximation: the image is
 * taken as hidden or seen whole (its ray passes inside or outside the body), and then the seen images
 * are taken as a point source's, never above the whole disk's magnification.
 */

// From its module, not the layer's index: the index also holds the live-event fit (ml-matrix), which the
// bench page must not load.
import { finiteSourceMagnification } from "@/lib/lensing/finite-source";
import { pointLensImages } from "@/lib/physics";

/** The source's size "limits" the magnification when it moves it by more than this share from a point source's. */
const SOURCE_SIZE_LIMIT_SHARE = 0.01;

export interface EventMagnification {
  magnification: number;
  /** The magnification a point source would have (of the images seen). */
  pointSourceMagnification: number;
  /** The finite-source value differs from the point source's by more than SOURCE_SIZE_LIMIT_SHARE. */
  isLimitedBySourceSize: boolean;
}

/** The event's source as the magnification sees it: its disk and what the lens's body hides. */
export interface EventSourceDisk {
  /** The source's radius in θ_E (ρ), whose finite-source magnification is drawn; null for a point source. */
  sourceRadiusThetaE: number | null;
  /** Linear limb-darkening coefficient of the source disk (0: uniform). */
  limbDarkeningU: number;
  /** Images closer to the lens than this (θ_E) are behind its body; 0 for a compact lens. */
  occultingRadiusThetaE: number;
}

/** Magnification at offset `u` (θ_E, ≥ 0) of the event's source, as an observer sees it; a point source when ρ is null. */
export function eventMagnification(u: number, event: EventSourceDisk): EventMagnification {
  const images = pointLensImages(u);
  const isPlusSeen = images.thetaPlus >= event.occultingRadiusThetaE;
  const isMinusSeen = Math.abs(images.thetaMinus) >= event.occultingRadiusThetaE;
  const wholeDisk = event.sourceRadiusThetaE === null ? images.magnificationTotal : finiteSourceMagnification(u, event.sourceRadiusThetaE, event.limbDarkeningU);
  const pointSource = isPlusSeen && isMinusSeen ? images.magnificationTotal : (isPlusSeen ? images.magnificationPlus : 0) + (isMinusSeen ? Math.abs(images.magnificationMinus) : 0);
  const magnification = isPlusSeen && isMinusSeen ? wholeDisk : Math.min(pointSource, wholeDisk);
  const isLimitedBySourceSize = Math.abs(magnification - pointSource) > SOURCE_SIZE_LIMIT_SHARE * pointSource;
  return { magnification, pointSourceMagnification: pointSource, isLimitedBySourceSize };
}

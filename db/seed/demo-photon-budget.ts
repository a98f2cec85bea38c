import { and, eq, isNull } from "drizzle-orm";
import type { Database } from "@/db/client";
import { proposals, targets, users } from "@/db/schema";
import { runSeedOnce } from "@/db/seed/run-once";
import { demoAccounts, demoProposal } from "@/db/seed/demo-scenario";
import { photometrySettingsSchema, type PhotometrySettingsInput } from "@/lib/workspace/photometry-schema";

/**
 * The demo team's camera: a 3.6 m telescope with adaptive optics imaging in Ks, where the bulge's
 * dust dims the sources least (invented, plausible figures: a 1.1 m obstruction, 35% throughput, an
 * infrared array's 12 e⁻ read noise and 0.05 e⁻/s dark current, 20 mas pixels, 60 mas delivered FWHM
 * at the zenith, 90 s to acquire and close the loop). The site's Ks sky is the typical dark site's.
 */
export const demoPhotometry: PhotometrySettingsInput = {
  apertureM: 3.6,
  centralObstructionM: 1.1,
  throughput: 0.35,
  readNoiseElectrons: 12,
  darkElectronsPerSPerPixel: 0.05,
  gainElectronsPerAdu: 2.5,
  fullWellElectrons: 150_000,
  pixelScaleArcsec: 0.02,
  seeingFwhmArcsec: 0.06,
  apertureRadiusFwhm: 1.0,
  psfShape: "moffat",
  overheadS: 90,
  signalToNoiseGoal: 50,
  bandId: "2mass-ks",
};

/**
 * Each demo target's source in Ks (its own magnitude, unmagnified) and blend fraction f_s: bulge
 * giants and dwarfs behind a crowded field, quasar images behind galaxies (invented values).
 * Cinder Bunting is a faint dwarf in a bright blend: the depth answer fails for it.
 */
export const demoSourcePhotometry: Record<string, { sourceMagnitude: number; blendFraction: number }> = {
  "Cinder Avocet": { sourceMagnitude: 17.8, blendFraction: 0.7 },
  "Cinder Bunting": { sourceMagnitude: 23.4, blendFraction: 0.1 },
  "Cinder Curlew": { sourceMagnitude: 16.9, blendFraction: 0.85 },
  "Cinder Dunlin": { sourceMagnitude: 15.2, blendFraction: 1 },
  "Cinder Egret": { sourceMagnitude: 18.4, blendFraction: 0.4 },
  "Cinder Fieldfare": { sourceMagnitude: 17.1, blendFraction: 0.6 },
  "Cinder Godwit": { sourceMagnitude: 18.0, blendFraction: 0.5 },
  "Lantern Arc": { sourceMagnitude: 18.6, blendFraction: 1 },
  "Quillfeather Lens": { sourceMagnitude: 19.4, blendFraction: 1 },
  "Hollowmere Pair": { sourceMagnitude: 18.9, blendFraction: 1 },
  "Saltmarsh Arc": { sourceMagnitude: 20.3, blendFraction: 1 },
  "Vesper Ring": { sourceMagnitude: 19.8, blendFraction: 1 },
};

/**
 * Gives the demo proposal its camera and the demo targets their sources' magnitudes, once, so the
 * photon budget and the time request show from the first start. A team's later edits are kept: the
 * proposal is set only while it has no aperture, a target only while it has no source magnitude.
 */
export async function seedDemoPhotonBudget(db: Database): Promise<boolean> {
  return runSeedOnce(db, "demo-photon-budget-v1", async (tx) => {
    const piEmail = demoAccounts.find((a) => a.key === "pi")!.email;
    const [pi] = await tx.select({ id: users.id }).from(users).where(eq(users.email, piEmail)).limit(1);
    if (!pi) return;
    const [main] = await tx.select().from(proposals).where(and(eq(proposals.createdBy, pi.id), eq(proposals.title, demoProposal.title))).limit(1);
    if (!main) return;
    const current = photometrySettingsSchema.safeParse(main.photometry ?? {});
    if (current.success && current.data.apertureM === null) {
      await tx.update(proposals).set({ photometry: photometrySettingsSchema.parse(demoPhotometry) }).where(eq(proposals.id, main.id));
    }
    for (const [name, source] of Object.entries(demoSourcePhotometry)) {
      await tx
        .update(targets)
        .set(source)
        .where(and(eq(targets.proposalId, main.id), eq(targets.name, name), isNull(targets.sourceMagnitude)));
    }
    // Version 0: the startup re-derivation computes every target's budget under the new camera.
    await tx.update(targets).set({ derivationVersion: 0 }).where(eq(targets.proposalId, main.id));
  });
}

import * as THREE from "three";
import { sceneBackground, type Inked, type SceneInk } from "./scene-colours";

/** Recolours the background and every material tagged with `inkData`, in place (no new objects). */
export function applyInk(scene: THREE.Scene, ink: SceneInk): void {
  if (scene.background instanceof THREE.Color) scene.background.set(sceneBackground[ink]);
  scene.traverse((object) => {
    const material = (object as THREE.Mesh).material;
    if (material === undefined) return;
    for (const each of Array.isArray(material) ? material : [material]) {
      const inks = (each.userData as { inks?: Inked }).inks;
      if (inks === undefined || !("color" in each) || !(each.color instanceof THREE.Color)) continue;
      each.color.set(inks[ink].color);
      each.opacity = inks[ink].opacity;
    }
  });
}

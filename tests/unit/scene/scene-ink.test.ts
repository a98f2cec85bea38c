import { describe, expect, it } from "vitest";
import * as THREE from "three";
import { inkData, sceneBackground, sceneInks } from "@/components/scene/scene-colours";
import { applyInk } from "@/components/scene/scene-ink";

describe("the 3D view's inks", () => {
  it("recolours the background and the tagged materials for print and back, leaving others alone", () => {
    const scene = new THREE.Scene();
    scene.background = new THREE.Color(sceneBackground.screen);
    const tagged = new THREE.LineBasicMaterial({ color: sceneInks.wavefront.screen.color, transparent: true, userData: inkData(sceneInks.photonSphere) });
    const untagged = new THREE.MeshBasicMaterial({ color: "#123456" });
    scene.add(new THREE.LineSegments(new THREE.BufferGeometry(), [tagged]));
    scene.add(new THREE.Mesh(new THREE.BufferGeometry(), untagged));

    applyInk(scene, "print");
    expect(`#${(scene.background as THREE.Color).getHexString()}`).toBe("#ffffff");
    expect(`#${tagged.color.getHexString()}`).toBe(sceneInks.photonSphere.print.color.toLowerCase());
    expect(tagged.opacity).toBe(sceneInks.photonSphere.print.opacity);
    expect(untagged.color.getHexString()).toBe("123456");

    applyInk(scene, "screen");
    expect(`#${(scene.background as THREE.Color).getHexString()}`).toBe(sceneBackground.screen);
    expect(`#${tagged.color.getHexString()}`).toBe(sceneInks.photonSphere.screen.color.toLowerCase());
    expect(tagged.opacity).toBe(sceneInks.photonSphere.screen.opacity);
  });
});

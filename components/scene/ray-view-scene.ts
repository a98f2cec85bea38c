import * as THREE from "three";
import { RAY_FATES, type AssembledBundle, type RayFate } from "@/lib/bench/assemble-bundle";
import { progressiveFrames, type DrawGroup } from "@/lib/bench/progressive-draw";
import { fateStyles } from "./fate-styles";

/** What the camera is built from, once: lengths in units of M, field of view in degrees. */
export interface ViewCamera {
  fovDeg: number;
  near: number;
  far: number;
}

/** Where the camera is: position (units of M) and orientation (a unit quaternion x, y, z, w). */
export interface CameraPose {
  position: [number, number, number];
  quaternion: [number, number, number, number];
}

/** The view's size on screen in CSS pixels (drawn at one device pixel each). */
export interface ViewSize {
  widthPx: number;
  heightPx: number;
}

/** Background of the view (sRGB). */
const BACKGROUND = "#05070c";

/**
 * The 3D ray-bundle scene on a canvas of its own (an OffscreenCanvas in the view worker): the mass at
 * the centre, the bundle's rays coloured by fate and its wavefronts. A bundle is drawn over several
 * frames onto the preserved drawing buffer (see progressive-draw): the first step clears and draws the
 * scene without the bundle plus the first share of the rays, each later step adds one share without
 * clearing, the last adds the wavefronts. A change of view, size or bundle starts again from the first.
 */
export class RayViewScene {
  private readonly renderer: THREE.WebGLRenderer;
  private readonly scene = new THREE.Scene();
  private readonly camera: THREE.PerspectiveCamera;
  private readonly rays: THREE.LineSegments;
  private readonly fronts: THREE.LineSegments;
  private bundle: AssembledBundle | undefined;
  private frames: DrawGroup[][] = [];
  /** Steps drawn since the last restart; the picture is complete at `stepCount()`. */
  private stepsDrawn = 0;

  constructor(canvas: OffscreenCanvas, size: ViewSize, camera: ViewCamera, pose: CameraPose) {
    // Kept between frames: the bundle is drawn onto it over several frames, and a PNG is read from it.
    // No MSAA: software rendering multiplied the draw time by about 3.5.
    this.renderer = new THREE.WebGLRenderer({ canvas, alpha: true, antialias: false, preserveDrawingBuffer: true, powerPreference: "high-performance" });
    this.renderer.toneMapping = THREE.ACESFilmicToneMapping;
    this.renderer.setPixelRatio(1);
    this.camera = new THREE.PerspectiveCamera(camera.fovDeg, 1, camera.near, camera.far);
    this.scene.background = new THREE.Color(BACKGROUND);
    this.scene.add(lensMass());
    // Built once for the view, not per bundle: disposing a bundle's last dashed material made three.js
    // delete its shader program, so every new bundle relinked it and the software GPU recompiled its
    // pipeline inside the first frame (a 50-80 ms task).
    this.rays = new THREE.LineSegments(new THREE.BufferGeometry(), RAY_FATES.map(fateMaterial));
    this.fronts = new THREE.LineSegments(new THREE.BufferGeometry(), new THREE.LineBasicMaterial({ color: "#f4f1ea", depthTest: false }));
    // The bundle spans the whole view; culling would only cost a bounding-sphere pass over every vertex.
    this.rays.frustumCulled = false;
    this.fronts.frustumCulled = false;
    this.scene.add(this.rays, this.fronts);
    this.setPose(pose);
    this.setSize(size);
  }

  setSize({ widthPx, heightPx }: ViewSize): void {
    const current = this.renderer.getSize(new THREE.Vector2());
    if (current.x === widthPx && current.y === heightPx) return;
    this.renderer.setSize(widthPx, heightPx, false);
    this.camera.aspect = widthPx / Math.max(1, heightPx);
    this.camera.updateProjectionMatrix();
    this.stepsDrawn = 0;
  }

  setPose({ position, quaternion }: CameraPose): void {
    this.camera.position.fromArray(position);
    this.camera.quaternion.fromArray(quaternion);
    this.stepsDrawn = 0;
  }

  /** Replaces the bundle on show (its buffers are uploaded at its first step). */
  setBundle(bundle: AssembledBundle): void {
    const rays = new THREE.BufferGeometry();
    rays.setAttribute("position", new THREE.BufferAttribute(bundle.vertices, 3));
    rays.setAttribute("lineDistance", new THREE.BufferAttribute(bundle.lineDistances, 1));
    rays.setIndex(new THREE.BufferAttribute(bundle.segmentIndex, 1));
    const fronts = new THREE.BufferGeometry();
    fronts.setAttribute("position", new THREE.BufferAttribute(bundle.wavefrontVertices, 3));
    this.rays.geometry.dispose();
    this.fronts.geometry.dispose();
    this.rays.geometry = rays;
    this.fronts.geometry = fronts;
    this.bundle = bundle;
    this.frames = progressiveFrames(bundle.fateGroups);
    this.stepsDrawn = 0;
  }

  /** Whether the picture on the buffer shows everything (scene, and the whole bundle if any). */
  isComplete(): boolean {
    return this.stepsDrawn >= this.stepCount();
  }

  /** Draws the next step; false when there was nothing left to draw. */
  drawStep(): boolean {
    if (this.isComplete()) return false;
    const step = this.stepsDrawn;
    const autoClear = this.renderer.autoClear;
    if (step === 0) {
      this.rays.visible = false;
      this.fronts.visible = false;
      this.renderer.render(this.scene, this.camera);
    }
    this.renderer.autoClear = false;
    if (this.bundle !== undefined) {
      this.rays.visible = true;
      this.rays.geometry.groups = this.frames[step];
      this.renderer.render(this.rays, this.camera);
    }
    this.stepsDrawn += 1;
    if (this.bundle !== undefined && this.isComplete()) {
      this.fronts.visible = true;
      this.renderer.render(this.fronts, this.camera);
    }
    this.renderer.autoClear = autoClear;
    return true;
  }

  /** Draws whatever is left at once. */
  drawRemaining(): void {
    while (this.drawStep());
  }

  /** Waits until the GPU has carried out every drawing command so far (a one-pixel readback). */
  finishDrawing(): void {
    const gl = this.renderer.getContext();
    gl.readPixels(0, 0, 1, 1, gl.RGBA, gl.UNSIGNED_BYTE, new Uint8Array(4));
  }

  /**
   * A PNG of the complete view at `scale` times its screen size: the drawing buffer is enlarged for the
   * snapshot only, the whole picture drawn into it at once, copied, and the view drawn back at screen
   * size before the frame is shown, so the screen never shows the enlarged buffer.
   */
  pngAtScale(canvas: OffscreenCanvas, scale: number): Promise<Blob> {
    this.renderer.setPixelRatio(scale);
    this.stepsDrawn = 0;
    this.drawRemaining();
    // The bitmap is copied when convertToBlob is called (HTML Standard, OffscreenCanvas); only the
    // encoding is asynchronous.
    const png = canvas.convertToBlob({ type: "image/png" });
    this.renderer.setPixelRatio(1);
    this.stepsDrawn = 0;
    this.drawRemaining();
    return png;
  }

  /** Steps a complete picture takes: one per frame's share of the bundle, or one for the scene alone. */
  private stepCount(): number {
    return this.bundle === undefined ? 1 : this.frames.length;
  }
}

/** The material a fate's rays are drawn with (see fate-styles). */
function fateMaterial(fate: RayFate): THREE.LineBasicMaterial | THREE.LineDashedMaterial {
  const style = fateStyles[fate];
  return style.dashM === undefined
    ? new THREE.LineBasicMaterial({ color: style.color, transparent: true, opacity: style.opacity, depthWrite: false })
    : new THREE.LineDashedMaterial({ color: style.color, dashSize: style.dashM, gapSize: style.gapM, transparent: true, opacity: style.opacity, depthWrite: false });
}

/** The mass at the centre, in units of M: the horizon r = 2M (opaque) inside the photon sphere r = 3M (wire). */
function lensMass(): THREE.Group {
  const group = new THREE.Group();
  group.add(
    new THREE.Mesh(new THREE.SphereGeometry(2, 48, 24), new THREE.MeshBasicMaterial({ color: "#000000" })),
    new THREE.Mesh(new THREE.SphereGeometry(2.02, 24, 12), new THREE.MeshBasicMaterial({ color: "#8f8a80", wireframe: true, transparent: true, opacity: 0.35 })),
    new THREE.Mesh(new THREE.SphereGeometry(3, 32, 16), new THREE.MeshBasicMaterial({ color: "#CC79A7", wireframe: true, transparent: true, opacity: 0.35 })),
  );
  return group;
}

import { type Matrix, zeroMatrix } from './dense-matrix.js';
import type { SisoStateSpace } from './state-space-realisation.js';

/**
 * The unity-feedback loop cut open at the delayed plant input w(t):
 *
 *   x' = F x + G w + H r,   x = [plant states; controller states]
 *   u  = K x + Dc r − Dc·Dp w          (controller output, e = r − y)
 *   y  = Cy x + Dp w                   (plant output)
 *
 * and w(t) = u(t − T) + d(t − T) closes it through the delay T (d is the
 * load disturbance added at the plant input). Keeping w explicit lets the
 * delayed simulation treat it as a known input on each step, and the
 * delay-free loop solve for it algebraically.
 */
export interface LoopEquations {
  order: number;
  plantOrder: number;
  f: Matrix;
  g: number[];
  h: number[];
  k: number[];
  controllerFeedthrough: number;
  plantFeedthrough: number;
  cy: number[];
}

export function assembleLoopEquations(plant: SisoStateSpace, controller: SisoStateSpace): LoopEquations {
  const np = plant.a.length;
  const nc = controller.a.length;
  const n = np + nc;
  const f = zeroMatrix(n, n);
  const g = new Array<number>(n).fill(0);
  const h = new Array<number>(n).fill(0);
  const k = new Array<number>(n).fill(0);
  const cy = new Array<number>(n).fill(0);
  for (let i = 0; i < np; i++) {
    for (let j = 0; j < np; j++) f[i][j] = plant.a[i][j];
    g[i] = plant.b[i];
    cy[i] = plant.c[i];
    k[i] = -controller.d * plant.c[i];
  }
  for (let i = 0; i < nc; i++) {
    // xc' = Ac xc + Bc (r − Cp xp − Dp w)
    for (let j = 0; j < nc; j++) f[np + i][np + j] = controller.a[i][j];
    for (let j = 0; j < np; j++) f[np + i][j] = -controller.b[i] * plant.c[j];
    g[np + i] = -controller.b[i] * plant.d;
    h[np + i] = controller.b[i];
    k[np + i] = controller.c[i];
  }
  return {
    order: n,
    plantOrder: np,
    f,
    g,
    h,
    k,
    controllerFeedthrough: controller.d,
    plantFeedthrough: plant.d,
    cy,
  };
}

/**
 * State matrix of the loop without delay, where w = u + d is solved from
 * w = K x + Dc r + d − Dc·Dp w: A = F + G K / (1 + Dc·Dp). Null when the loop
 * is not well posed (1 + Dc·Dp = 0).
 */
export function delayFreeStateMatrix(loop: LoopEquations): Matrix | null {
  const denom = 1 + loop.controllerFeedthrough * loop.plantFeedthrough;
  if (denom === 0) return null;
  return loop.f.map((row, i) => row.map((v, j) => v + (loop.g[i] * loop.k[j]) / denom));
}

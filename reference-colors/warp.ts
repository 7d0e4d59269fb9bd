import { CIEDE2000_FORMULA as F } from '../shared/colour/constants.js';
import type { Lab } from '../shared/colour/lab.js';

/*
 * A map of CIELAB into a space where straight-line distance is close to ΔE00 between nearby
 * colours, so that a regular lattice there gives chips about evenly spaced by ΔE00. It follows the
 * local form of CIEDE2000 (Sharma, Wu & Dalal 2005, eqs. 2–22), pair mean ≈ the colour itself:
 *
 *   lightness  x = ∫₀ᴸ dL / S_L(L)
 *   chroma     ρ = ∫₀ᶜ k / S_C(c·k) dc along the ray of constant ab-hue θ, where
 *              k = |(1 + G(c))·cos θ, sin θ| is how much a′ = (1 + G)·a stretches that ray
 *              (G is shared by the pair, so it scales differences but is not differentiated)
 *   hue        φ = Φ(h′) with h′ = atan2(b, a′), Φ stretching the circle by 1/S_H(C₀, h′) at a
 *              typical tissue chroma C₀ (T of eq. 15 varies from 0.36 to 1.57 round the circle)
 *   (y, z) = ρ·(cos φ, sin φ)
 *
 * What is left over: S_H's dependence on chroma and hue together, and R_T's rotation (blues,
 * ignored). The map only places candidate chips; coverage is measured with the true ΔE00.
 */

const L_STEPS = 10000;
const C_MAX = 250;
const C_STEP = 0.05;
const Q_STEPS = 100;
const H_STEPS = 36000;
/** Chroma at which the hue stretch Φ is fitted (our own: the middle of the tissue regions). */
const HUE_FIT_CHROMA = 30;

const D2R = Math.PI / 180;

function sl(l: number): number {
  const d2 = (l - F.slCentre) * (l - F.slCentre);
  return 1 + (F.slSlope * d2) / Math.sqrt(F.slOffset + d2);
}

function gOf(c: number): number {
  const c7 = Math.pow(c, 7);
  return 0.5 * (1 - Math.sqrt(c7 / (c7 + Math.pow(F.chromaPivot, 7))));
}

function tOf(h: number): number {
  const [k1, k2, k3, k4] = F.tCoefficients;
  return 1 - k1 * Math.cos(h - 30 * D2R) + k2 * Math.cos(2 * h) + k3 * Math.cos(3 * h + 6 * D2R) - k4 * Math.cos(4 * h - 63 * D2R);
}

/** Cumulative trapezoid integral of `f` on [0, n·step], n + 1 samples. */
function cumulative(n: number, step: number, f: (x: number) => number): Float64Array {
  const table = new Float64Array(n + 1);
  for (let i = 1; i <= n; i++) table[i] = table[i - 1] + (step * (f((i - 1) * step) + f(i * step))) / 2;
  return table;
}

/** Linear interpolation in a table sampled every `step` from 0. */
function lookup(table: Float64Array, step: number, x: number): number {
  const pos = Math.min(Math.max(x / step, 0), table.length - 1);
  const i = Math.min(Math.floor(pos), table.length - 2);
  return table[i] + (table[i + 1] - table[i]) * (pos - i);
}

/** Inverse of `lookup` for an increasing table. */
function inverse(table: Float64Array, step: number, y: number): number {
  let lo = 0;
  let hi = table.length - 1;
  if (y <= table[0]) return 0;
  if (y >= table[hi]) return hi * step;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (table[mid] <= y) lo = mid;
    else hi = mid;
  }
  const span = table[hi] - table[lo];
  return (lo + (span > 0 ? (y - table[lo]) / span : 0)) * step;
}

const X_OF_L = cumulative(L_STEPS, 100 / L_STEPS, (l) => 1 / sl(l));

/** ρ(C) tables, one per q = cos²θ = 0, 1/Q_STEPS, … 1. */
const RHO_OF_C: Float64Array[] = Array.from({ length: Q_STEPS + 1 }, (_, j) => {
  const q = j / Q_STEPS;
  return cumulative(Math.round(C_MAX / C_STEP), C_STEP, (c) => {
    const k = Math.sqrt((1 + gOf(c)) ** 2 * q + (1 - q));
    return k / (1 + F.scSlope * c * k);
  });
});

const PHI_RAW = cumulative(H_STEPS, (2 * Math.PI) / H_STEPS, (h) => (1 + F.shSlope * HUE_FIT_CHROMA) / (1 + F.shSlope * HUE_FIT_CHROMA * tOf(h)));
const PHI_SCALE = (2 * Math.PI) / PHI_RAW[H_STEPS];
const PHI_OF_H = PHI_RAW.map((v) => v * PHI_SCALE);

/** Largest warped lightness, x(100). */
export const X_MAX = X_OF_L[L_STEPS];

function rhoOf(c: number, q: number): number {
  const pos = Math.min(Math.max(q, 0), 1) * Q_STEPS;
  const j = Math.min(Math.floor(pos), Q_STEPS - 1);
  const lo = lookup(RHO_OF_C[j], C_STEP, c);
  const hi = lookup(RHO_OF_C[j + 1], C_STEP, c);
  return lo + (hi - lo) * (pos - j);
}

const TWO_PI = 2 * Math.PI;
const wrap = (angle: number) => ((angle % TWO_PI) + TWO_PI) % TWO_PI;

/** CIELAB → warped (x, y, z). */
export function warp(lab: Lab): [number, number, number] {
  const c = Math.hypot(lab.a, lab.b);
  const x = lookup(X_OF_L, 100 / L_STEPS, lab.l);
  if (c === 0) return [x, 0, 0];
  const q = (lab.a / c) ** 2;
  const rho = rhoOf(c, q);
  const hp = wrap(Math.atan2(lab.b, lab.a * (1 + gOf(c))));
  const phi = lookup(PHI_OF_H, TWO_PI / H_STEPS, hp);
  return [x, rho * Math.cos(phi), rho * Math.sin(phi)];
}

/** Warped (x, y, z) → CIELAB; C*ab found by bisection since θ depends on G(C). */
export function unwarp([x, y, z]: readonly [number, number, number]): Lab {
  const l = inverse(X_OF_L, 100 / L_STEPS, x);
  const rho = Math.hypot(y, z);
  if (rho === 0) return { l, a: 0, b: 0 };
  const hp = inverse(PHI_OF_H, TWO_PI / H_STEPS, wrap(Math.atan2(z, y)));
  const thetaAt = (c: number) => Math.atan2((1 + gOf(c)) * Math.sin(hp), Math.cos(hp));
  let lo = 0;
  let hi = C_MAX;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (rhoOf(mid, Math.cos(thetaAt(mid)) ** 2) < rho) lo = mid;
    else hi = mid;
  }
  const c = (lo + hi) / 2;
  const theta = thetaAt(c);
  return { l, a: c * Math.cos(theta), b: c * Math.sin(theta) };
}

import { F, STRIDE } from './run';

/** Linear map from (cost, loss) to layer pixels: x = (cost − costAt0)·xPerCost, y = (loss − lossAt0)·yPerLoss (y grows downwards, so yPerLoss < 0). */
export interface PixelMap { costAt0: number; xPerCost: number; lossAt0: number; yPerLoss: number }

/** The cloud drawn as one bitmap, and a bucket grid over it to find the point under the pointer. */
export interface CloudLayer {
  width: number;
  height: number;
  /** Points painted (every feasible point inside the plot). */
  drawn: number;
  /** RGBA, straight alpha, row by row (ready for `new ImageData(pixels, width)`). */
  pixels: Uint8ClampedArray;
  /** Pixel position of every point (NaN where not drawn: infeasible or outside). */
  px: Float32Array;
  py: Float32Array;
  cell: number;
  cols: number;
  /** First point of each bucket and the next point in the same bucket (−1 ends a list). */
  head: Int32Array;
  next: Int32Array;
}

/** '#rrggbb' → [r, g, b]. */
export function rgbOf(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1, 7), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** An empty cloud layer of width×height pixels for `count` points, hover buckets of `cell` pixels. */
export function newCloud(count: number, width: number, height: number, cell = 8): CloudLayer {
  const w = Math.max(1, Math.floor(width)), h = Math.max(1, Math.floor(height));
  const cols = Math.ceil(w / cell), rows = Math.ceil(h / cell);
  return {
    width: w, height: h, drawn: 0, pixels: new Uint8ClampedArray(w * h * 4),
    px: new Float32Array(count).fill(Number.NaN), py: new Float32Array(count).fill(Number.NaN),
    cell, cols, head: new Int32Array(cols * rows).fill(-1), next: new Int32Array(count).fill(-1),
  };
}

/**
 * Paints points [from, to): each feasible one a `dot`×`dot` pixel square in its scheme's colour at opacity
 * `alpha`, composited source-over in point order (where points pile up the colour deepens), and files it
 * in its hover bucket. No canvas calls; painting in slices gives the same bitmap as painting at once.
 */
export function paintCloud(layer: CloudLayer, data: Float64Array, from: number, to: number, colours: [number, number, number][], map: PixelMap, dot = 2, alpha = 0.28): void {
  const { width: w, height: h, pixels, px, py, cell, cols, head, next } = layer;
  const keep = 1 - alpha, offset = Math.floor(dot / 2), a255 = alpha * 255;
  const rgb = new Float32Array(colours.length * 3);
  colours.forEach(([r, g, b], s) => { rgb[s * 3] = r; rgb[s * 3 + 1] = g; rgb[s * 3 + 2] = b; });
  const { costAt0, xPerCost, lossAt0, yPerLoss } = map;
  let drawn = 0;
  for (let i = from; i < to; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] !== 1) continue;
    const x = (data[o + F.cost]! - costAt0) * xPerCost, y = (data[o + F.lossW]! - lossAt0) * yPerLoss;
    if (!(x >= 0 && x < w && y >= 0 && y < h)) continue;
    px[i] = x; py[i] = y;
    drawn++;
    const b = ((y / cell) | 0) * cols + ((x / cell) | 0);
    next[i] = head[b]!; head[b] = i;
    const s3 = (data[o]! | 0) * 3;
    const r = rgb[s3]!, g = rgb[s3 + 1]!, bl = rgb[s3 + 2]!;
    const x0 = Math.max(0, ((x + 0.5) | 0) - offset), x1 = Math.min(w, x0 + dot), y0 = Math.max(0, ((y + 0.5) | 0) - offset), y1 = Math.min(h, y0 + dot);
    for (let yy = y0; yy < y1; yy++) {
      for (let p = (yy * w + x0) * 4, end = (yy * w + x1) * 4; p < end; p += 4) {
        // Source-over in straight alpha: out α = α + αd(1 − α); out colour = (c·α + cd·αd(1 − α)) / out α.
        const under = (pixels[p + 3]! / 255) * keep, out = alpha + under, k = 1 / out;
        pixels[p] = (r * alpha + pixels[p]! * under) * k; pixels[p + 1] = (g * alpha + pixels[p + 1]! * under) * k;
        pixels[p + 2] = (bl * alpha + pixels[p + 2]! * under) * k; pixels[p + 3] = a255 + pixels[p + 3]! * keep;
      }
    }
  }
  layer.drawn += drawn;
}

/** The whole cloud in one go (see `paintCloud`). */
export function drawCloud(data: Float64Array, count: number, colours: [number, number, number][], map: PixelMap, width: number, height: number, dot = 2, alpha = 0.28, cell = 8): CloudLayer {
  const layer = newCloud(count, width, height, cell);
  paintCloud(layer, data, 0, count, colours, map, dot, alpha);
  return layer;
}

/** The drawn point nearest to (x, y) within `radius` pixels, or −1. */
export function nearestInCloud(layer: CloudLayer, x: number, y: number, radius: number): number {
  const { cell, cols, head, next, px, py } = layer;
  const rows = head.length / cols;
  let best = -1, bestD = radius * radius;
  for (let cy = Math.max(0, Math.floor((y - radius) / cell)); cy <= Math.min(rows - 1, Math.floor((y + radius) / cell)); cy++) {
    for (let cx = Math.max(0, Math.floor((x - radius) / cell)); cx <= Math.min(cols - 1, Math.floor((x + radius) / cell)); cx++) {
      for (let i = head[cy * cols + cx]!; i !== -1; i = next[i]!) {
        const d = (px[i]! - x) ** 2 + (py[i]! - y) ** 2;
        if (d <= bestD) { bestD = d; best = i; }
      }
    }
  }
  return best;
}

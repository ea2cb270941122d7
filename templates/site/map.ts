// The index's map of the stations, drawn once at build time as plain SVG numbers: land from the
// Natural Earth outlines (public domain) as packaged by world-atlas, projected with d3-geo onto a frame
// chosen from the stations' own bounding box. Nothing is fetched when the page is read: no tiles, no
// script. A station is a dot the template makes a link of.
import { createRequire } from 'node:module';
import {
  geoMercator, geoNaturalEarth1, geoPath, type GeoProjection,
} from 'd3-geo';
import { itemAt, lastOf } from '../../engine/index.js';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';

export interface MapStation {
  id: string;
  name: string;
  url: string;
  latitude: number;
  longitude: number; // east positive
}

export interface MapDot extends MapStation {
  x: number; // where the dot is drawn
  y: number;
  atX: number; // where the station is; a dot moved off it to stay clickable gets a leader line
  atY: number;
  moved: boolean;
}

export interface StationMap {
  width: number;
  height: number;
  land: string; // SVG path data, clipped to the frame ('' when no land is in frame)
  dots: MapDot[];
}

/** Width of the map's frame in SVG units; its height follows the stations' extent. */
export const MAP_WIDTH = 800;
const MIN_HEIGHT = 260;
const MAX_HEIGHT = 560;
const PAD = 28; // room around the outermost dots, in SVG units
const MARGIN_DEG = 1.5; // sea shown beyond the outermost stations, in degrees of latitude
const WORLD_SPAN_DEG = 100; // wider than this, a whole-world projection reads better than Mercator
const COARSE_SPAN_DEG = 40; // wider than this, the 1:110 million outline is detailed enough
const DOT_GAP = 15; // dots closer than this (SVG units) are moved apart, so each can be chosen
const SPREAD_ROUNDS = 40;

/**
 * Moves dots apart until none is closer than DOT_GAP to another (or the rounds run out): each pair too
 * close is pushed apart along the line between them, dots on the same spot in a circle first.
 */
export function spreadDots(points: { x: number; y: number }[], width: number, height: number): { x: number; y: number }[] {
  const at = points.map((p) => ({ x: p.x, y: p.y }));
  const same = new Map<string, number>();
  for (const p of at) {
    const key = `${Math.round(p.x)},${Math.round(p.y)}`;
    const n = same.get(key) ?? 0;
    same.set(key, n + 1);
    if (n > 0) { // a ring around the shared spot, a little wider for each dot already there
      p.x += Math.cos(n * 2.4) * (DOT_GAP / 2) * Math.sqrt(n);
      p.y += Math.sin(n * 2.4) * (DOT_GAP / 2) * Math.sqrt(n);
    }
  }
  for (let round = 0; round < SPREAD_ROUNDS; round++) {
    let moved = false;
    for (const [i, a] of at.entries()) {
      for (const [j, b] of at.entries()) {
        if (j <= i) continue; // each pair once
        const dx = b.x - a.x;
        const dy = b.y - a.y;
        const d = Math.hypot(dx, dy);
        if (d >= DOT_GAP) continue;
        const push = (DOT_GAP - d) / 2 + 0.01;
        const [ux, uy] = d > 1e-6 ? [dx / d, dy / d] : [Math.cos(j), Math.sin(j)];
        a.x -= ux * push;
        a.y -= uy * push;
        b.x += ux * push;
        b.y += uy * push;
        moved = true;
      }
    }
    for (const p of at) {
      p.x = Math.min(width - DOT_GAP / 2, Math.max(DOT_GAP / 2, p.x));
      p.y = Math.min(height - DOT_GAP / 2, Math.max(DOT_GAP / 2, p.y));
    }
    if (!moved) break;
  }
  return at;
}

/**
 * The smallest run of longitudes holding every station (it may cross 180°): its west end and its
 * width in degrees, so a set around the date line is not drawn as two halves of the world.
 */
export function longitudeSpan(longitudes: readonly number[]): { west: number; span: number } {
  const sorted = [...new Set(longitudes.map((l) => ((l % 360) + 540) % 360 - 180))].sort((a, b) => a - b);
  if (sorted.length <= 1) return { west: sorted[0] ?? 0, span: 0 };
  // The widest gap between neighbours (going round) is the part of the world left out.
  let gap = -Infinity, west = 0;
  let previous = lastOf(sorted, 'longitudes') - 360; // the last one, a turn earlier, so the gap across 180° counts first
  for (const longitude of sorted) {
    if (longitude - previous > gap) {
      gap = longitude - previous;
      west = longitude;
    }
    previous = longitude;
  }
  return { west, span: 360 - gap };
}

type LandTopology = Topology<{ land: GeometryCollection }>;
const outlines = new Map<string, ReturnType<typeof feature>>();

function landOutline(scale: '110m' | '50m'): ReturnType<typeof feature> {
  let land = outlines.get(scale);
  if (!land) {
    const topology = createRequire(import.meta.url)(`world-atlas/land-${scale}.json`) as LandTopology;
    land = feature(topology, topology.objects.land);
    outlines.set(scale, land);
  }
  return land;
}

/** The map of a set of stations, or null when there is none. */
export function stationMap(stations: readonly MapStation[]): StationMap | null {
  if (stations.length === 0) return null;
  const lats = stations.map((s) => s.latitude);
  const { west, span } = longitudeSpan(stations.map((s) => s.longitude));
  const south = Math.max(-85, Math.min(...lats) - MARGIN_DEG);
  const north = Math.min(85, Math.max(...lats) + MARGIN_DEG);
  const midLat = (south + north) / 2;
  // Degrees of longitude shrink towards the poles: compare the two spans as distances.
  const lonMargin = MARGIN_DEG / Math.max(0.2, Math.cos((midLat * Math.PI) / 180));
  const wideSpan = Math.max(span * Math.cos((midLat * Math.PI) / 180), north - south);
  const centre = west + span / 2;
  const projection: GeoProjection = (span > WORLD_SPAN_DEG ? geoNaturalEarth1() : geoMercator()).rotate([-centre, 0]);
  // The frame: the corners and edge midpoints of the padded box, so curved edges stay inside it.
  const half = span / 2 + lonMargin;
  const box = {
    type: 'MultiPoint' as const,
    coordinates: [-1, -0.5, 0, 0.5, 1].flatMap((f) => [[centre + f * half, south], [centre + f * half, north], [centre + f * half, midLat]]),
  };
  projection.fitWidth(MAP_WIDTH - 2 * PAD, box);
  const [[, y0], [, y1]] = geoPath(projection).bounds(box);
  const height = Math.round(Math.min(MAX_HEIGHT, Math.max(MIN_HEIGHT, y1 - y0 + 2 * PAD)));
  projection.fitExtent([[PAD, PAD], [MAP_WIDTH - PAD, height - PAD]], box);
  projection.clipExtent([[0, 0], [MAP_WIDTH, height]]);

  const path = geoPath(projection).digits(1);
  const land = path(landOutline(wideSpan > COARSE_SPAN_DEG ? '110m' : '50m')) ?? '';
  const round = (v: number): number => Math.round(v * 10) / 10;
  const places = stations.map((s) => {
    const [x, y] = projection([s.longitude, s.latitude]) ?? [NaN, NaN];
    return { x, y };
  });
  const drawn = spreadDots(places, MAP_WIDTH, height);
  const dots = stations.map((s, i) => {
    const dot = itemAt(drawn, i, 'map dots'), place = itemAt(places, i, 'map places');
    const [x, y, atX, atY] = [round(dot.x), round(dot.y), round(place.x), round(place.y)];
    return { ...s, x, y, atX, atY, moved: Math.hypot(x - atX, y - atY) > 1 };
  });
  return { width: MAP_WIDTH, height, land, dots };
}

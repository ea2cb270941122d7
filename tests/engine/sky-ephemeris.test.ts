// The interpolated heights of ../../engine/sky/ephemeris.ts against astronomy-engine computing the
// same quantity directly at each instant (topocentric apparent altitude of date by Equator and
// Horizon, plus the upper limb and the 34′ of refraction of its SearchRiseSet).
import { Body, Equator, Horizon, KM_PER_AU, Observer } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { createSkyEphemeris, skyHeight, skySite, type SkyBody } from '../../engine/sky.js';

const RADIUS_KM: Record<SkyBody, number> = { sun: 695_700, moon: 1738.1 };

function direct(body: SkyBody, t: number, latitude: number, longitude: number): number {
  const observer = new Observer(latitude, longitude, 0);
  const eq = Equator(body === 'sun' ? Body.Sun : Body.Moon, new Date(t), observer, true, true);
  const altitude = Horizon(new Date(t), observer, eq.ra, eq.dec).altitude;
  return altitude + (Math.asin(RADIUS_KM[body] / KM_PER_AU / eq.dist) * 180) / Math.PI + 34 / 60;
}

describe('sun and moon heights above the rise/set horizon', () => {
  it('equal astronomy-engine within 1e-5° at 2,000 seeded instants and places, 1990–2060', () => {
    const eph = createSkyEphemeris();
    let seed = 17;
    const random = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const worst = { sun: 0, moon: 0 };
    for (let i = 0; i < 1000; i++) {
      const t = Math.round(Date.UTC(1990, 0, 1) + random() * 70 * 365.25 * 86_400_000);
      const latitude = random() * 170 - 85;
      const longitude = random() * 360 - 180;
      for (const body of ['sun', 'moon'] as const) {
        const d = Math.abs(skyHeight(eph, body, t, skySite(latitude, longitude)) - direct(body, t, latitude, longitude));
        worst[body] = Math.max(worst[body], d);
      }
    }
    expect(worst.sun).toBeLessThan(1e-5);
    expect(worst.moon).toBeLessThan(1e-5);
  });
});

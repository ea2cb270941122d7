// Tide events as the model prints them: UTC and local ISO instants, the local clock, mm heights.
import { clock, isoLocal, isoUtc, localDate, offsetString, roundToMinute } from '../localtime.js';
import type { AlmanacEvent, TideEvent } from '../types.js';

/** Metres rounded to the millimetre, never −0. */
export function mm(x: number): number {
  const r = Math.round(x * 1000) / 1000;
  return r === 0 ? 0 : r;
}

/**
 * One event for the model. `clock` and `offset` belong to the event's nearest minute (the day it is
 * printed on, see localtime's rounding rule); `local` keeps the second, with its own offset.
 */
export function almanacEvent(e: TideEvent, zone: string): AlmanacEvent {
  const height = mm(e.height);
  return {
    time: isoUtc(e.time),
    local: isoLocal(e.time, zone),
    clock: clock(e.time, zone),
    date: localDate(e.time, zone),
    offset: offsetString(roundToMinute(e.time), zone),
    type: e.type,
    height,
    belowDatum: height < 0,
  };
}

import { useSyncExternalStore } from 'react';
import { formatNumber } from '@/lib/format';

/**
 * Lengths are stored in millimetres and shown in the unit the person chose, kept in this browser:
 * every screen that shows a length (the workshop, the angle tools, the result form) reads and sets
 * the same choice, and a change on one shows at once on the others.
 */
export type LengthUnit = 'mm' | 'in';
const KEY = 'edgeledger.lengthUnit';
const MM_PER_INCH = 25.4;
const listeners = new Set<() => void>();

function readUnit(): LengthUnit {
  return typeof localStorage !== 'undefined' && localStorage.getItem(KEY) === 'in' ? 'in' : 'mm';
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function useLengthUnit(): [LengthUnit, (u: LengthUnit) => void] {
  const unit = useSyncExternalStore(subscribe, readUnit, () => 'mm' as LengthUnit);
  const setUnit = (u: LengthUnit) => {
    localStorage.setItem(KEY, u);
    listeners.forEach((l) => l());
  };
  return [unit, setUnit];
}

/** A length in mm written in the chosen unit: one decimal in mm, three in inches. */
export function formatLength(mm: number | null | undefined, unit: LengthUnit, signed = false, digits = unit === 'in' ? 3 : 1): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return '—';
  const value = unit === 'in' ? mm / MM_PER_INCH : mm;
  const text = formatNumber(Math.abs(value), digits);
  const sign = signed ? (value > 0 ? '+' : value < 0 ? '−' : '') : value < 0 ? '−' : '';
  return `${sign}${text}\u00a0${unit}`;
}

/** A typed length in the chosen unit, back to millimetres (NaN when not a number). */
export function toMillimetres(text: string, unit: LengthUnit): number {
  const t = text.trim().replace(',', '.');
  const n = t === '' ? Number.NaN : Number(t);
  if (unit === 'mm' || !Number.isFinite(n)) return n;
  // 25.4 has one decimal, so a plain decimal in inches is an exact decimal in mm with one more
  // place: rounded to it, "0.1" in is 2.54 mm, not the binary product's 2.5400000000000005.
  const places = /^[+-]?\d*\.?(\d*)$/.exec(t)?.[1].length;
  return places === undefined || places > 14 ? n * MM_PER_INCH : Number((n * MM_PER_INCH).toFixed(places + 1));
}

/** A length in mm as the text to put in a box in the chosen unit (no grouping, up to 4 decimals in inches). */
export function lengthText(mm: number, unit: LengthUnit): string {
  const value = unit === 'in' ? mm / MM_PER_INCH : mm;
  return String(Number(value.toFixed(unit === 'in' ? 4 : 3)));
}

/** A computation's message, written in mm (shared/geometry.ts), with each "N mm" in the chosen unit. */
export function lengthsIn(message: string, unit: LengthUnit): string {
  if (unit === 'mm') return message;
  return message.replace(/(-?\d+(?:\.\d+)?) mm\b/g, (_, n: string) => formatLength(Number(n), unit));
}

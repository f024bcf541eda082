import { useEffect, useState } from 'react';
import { formatNumber } from '@/lib/format';

/** Lengths are stored in millimetres and shown in the unit the person chose, kept in this browser. */
export type LengthUnit = 'mm' | 'in';
const KEY = 'edgeledger.lengthUnit';
const MM_PER_INCH = 25.4;

export function useLengthUnit(): [LengthUnit, (u: LengthUnit) => void] {
  const [unit, setUnit] = useState<LengthUnit>(() => (typeof localStorage !== 'undefined' && localStorage.getItem(KEY) === 'in' ? 'in' : 'mm'));
  useEffect(() => {
    localStorage.setItem(KEY, unit);
  }, [unit]);
  return [unit, setUnit];
}

/** A length in mm written in the chosen unit: one decimal in mm, three in inches. */
export function formatLength(mm: number | null | undefined, unit: LengthUnit, signed = false): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return '—';
  const value = unit === 'in' ? mm / MM_PER_INCH : mm;
  const text = formatNumber(Math.abs(value), unit === 'in' ? 3 : 1);
  const sign = signed ? (value > 0 ? '+' : value < 0 ? '−' : '') : value < 0 ? '−' : '';
  return `${sign}${text}\u00a0${unit}`;
}

/** A typed length in the chosen unit, back to millimetres (NaN when not a number). */
export function toMillimetres(text: string, unit: LengthUnit): number {
  const t = text.trim().replace(',', '.');
  const n = t === '' ? Number.NaN : Number(t);
  return unit === 'in' ? n * MM_PER_INCH : n;
}

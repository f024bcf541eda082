/**
 * How numbers, units and dates are written on Edgeledger's pages. One place, so a grit band
 * reads the same in every table.
 */
import type { GritBand } from '@/types/api';

const nbsp = '\u00a0';

/** A particle size in µm: two decimals below 1 µm, one below 100 µm, whole above. */
export function formatMicrometres(um: number | null | undefined): string {
  if (um === null || um === undefined || !Number.isFinite(um)) return '—';
  if (um < 1) return um.toFixed(2);
  if (um < 100) return um.toFixed(1);
  return Math.round(um).toString();
}

/** A grit band as "7.8–15.6 µm". */
export function formatGritBand(band: GritBand | null | undefined): string {
  if (!band) return '—';
  return `${formatMicrometres(band.loUm)}–${formatMicrometres(band.hiUm)}${nbsp}µm`;
}

/** A number with at most `digits` decimals, trailing zeros dropped; a dash when missing. */
export function formatNumber(value: number | null | undefined, digits = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return new Intl.NumberFormat('en-GB', { maximumFractionDigits: digits }).format(value);
}

/** A force in grams, e.g. "142 g". */
export function formatGrams(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, digits)}${nbsp}g`;
}

/**
 * An angle in degrees to at most two decimals, e.g. "15.5°", "30.81°": the same precision in the
 * tools and on a result, so one angle never reads two ways.
 */
export function formatDegrees(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value, digits)}°`;
}

/** A calendar date, e.g. "3 Mar 2025". */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '—';
  // A calendar date alone ("2026-09-01", as the wheel log keeps them) is that day wherever the reader is.
  const dateOnly = /^\d{4}-\d{2}-\d{2}$/.test(iso);
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', ...(dateOnly ? { timeZone: 'UTC' } : {}) }).format(d);
}

/** A date with time of day, for the review trail. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '—';
  return new Intl.DateTimeFormat('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  }).format(d);
}

/** Looks a stored value up in one of the shared vocabularies; falls back to the value itself. */
export function label<T extends Record<string, string>>(vocabulary: T, value: string | null | undefined): string {
  if (!value) return '—';
  return (vocabulary as Record<string, string>)[value] ?? value;
}

/** Fixed decimals without "-0.00". */
export function fixed(value: number, digits: number): string {
  const text = value.toFixed(digits);
  return Number(text) === 0 ? (0).toFixed(digits) : text.replace('-', '−');
}

/** Significant digits for values that span decades (Q, frequencies), trimmed of trailing zeros. */
export function sig(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '—';
  const text = Math.abs(value) >= 10 ** digits ? Math.round(value).toString() : Number(value.toPrecision(digits)).toString();
  return text.replace('-', '−');
}

/** Hz with k for thousands: 31.5, 250, 1k, 12.5k. */
export function hz(value: number): string {
  return value >= 1000 ? `${sig(value / 1000, 4)}k` : sig(value, 4);
}

/** Hours as "2 h 30 min", or minutes / seconds when short. */
export function duration(hours: number): string {
  const minutes = hours * 60;
  if (minutes < 1) return `${fixed(minutes * 60, 0)} s`;
  if (minutes < 60) return `${fixed(minutes, minutes < 10 ? 1 : 0)} min`;
  const whole = Math.floor(hours);
  const rest = Math.round((hours - whole) * 60);
  return rest === 60 ? `${whole + 1} h` : rest ? `${whole} h ${rest} min` : `${whole} h`;
}

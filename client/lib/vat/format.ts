// Times as the vat shows them: a clock face for timers, the time of day for readings.

const two = (n: number) => String(n).padStart(2, '0');

/** Returns a duration as "m:ss" or "h:mm:ss" (whole seconds, sign dropped). */
export function formatClock(ms: number): string {
  const total = Math.floor(Math.abs(ms) / 1000);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  return h > 0 ? `${h}:${two(m)}:${two(s)}` : `${m}:${two(s)}`;
}

/** Returns minutes as words for a target: "45 min", "1 h 30 min", "2 days". */
export function formatMinutes(minutes: number): string {
  const rounded = Math.round(minutes);
  if (rounded >= 2 * 1440 && rounded % 1440 === 0) return `${rounded / 1440} days`;
  if (rounded < 60) return `${rounded} min`;
  const h = Math.floor(rounded / 60);
  const m = rounded % 60;
  return m ? `${h} h ${m} min` : `${h} h`;
}

/** Returns the time of day of an instant on the phone, e.g. "14:05" or "2:05 PM". */
export function formatTimeOfDay(at: string | number): string {
  const date = new Date(at);
  return date.toLocaleTimeString(undefined, { hour: 'numeric', minute: '2-digit' });
}

/** Returns a calendar date for a checklist: "Sat 14 Mar". */
export function formatDay(isoDate: string): string {
  const date = new Date(`${isoDate}T12:00:00`);
  return date.toLocaleDateString(undefined, { weekday: 'short', day: 'numeric', month: 'short' });
}

// A three-way merge of two edits of one journal document (the editor's form, or the vat's
// document), used when a save is refused because the journal changed somewhere else.
// `base` is what both sides started from, `mine` what this page holds, `theirs` what the
// server holds now. A value changed on one side only takes that side; changed on both to
// different values is a conflict. Objects merge key by key; lists of the same length item by
// item (a step's start time from the vat and its note from the laptop both stay); weigh-ins
// are kept from both sides, since each is a weighing that happened.

/** One value both sides changed differently, by its path ("steps.2.actualMinutes"). */
export type MergeConflict = { path: string; base: unknown; mine: unknown; theirs: unknown };

export type MergeResult<T> = {
  /** Both sides' changes; where they conflict, mine (see resolve). */
  merged: T;
  conflicts: MergeConflict[];
  /** The paths the other side changed (what changed elsewhere), conflicts included. */
  theirChanges: string[];
};

type Options = {
  /** Keys that never count as a change (the editor's row keys for v-for). */
  ignoreKeys?: readonly string[];
  /** Lists whose items are kept from both sides (by value), e.g. "weighIns". */
  unionLists?: readonly string[];
};

const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

function same(a: unknown, b: unknown, ignore: ReadonlySet<string>): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b))
    return a.length === b.length && a.every((x, i) => same(x, b[i], ignore));
  if (isObject(a) && isObject(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    for (const k of keys) if (!ignore.has(k) && !same(a[k], b[k], ignore)) return false;
    return true;
  }
  return false;
}

/** Returns the merge of mine and theirs over base; never changes its arguments. */
export function merge3<T>(base: T, mine: T, theirs: T, options: Options = {}): MergeResult<T> {
  const ignore = new Set(options.ignoreKeys ?? []);
  const unions = new Set(options.unionLists ?? []);
  const conflicts: MergeConflict[] = [];
  const theirChanges: string[] = [];

  const walk = (b: unknown, m: unknown, t: unknown, path: string, key: string): unknown => {
    if (same(m, t, ignore)) return m;
    if (same(b, t, ignore)) return m;
    if (same(b, m, ignore)) {
      theirChanges.push(path);
      return t;
    }
    if (unions.has(key) && Array.isArray(b) && Array.isArray(m) && Array.isArray(t)) {
      theirChanges.push(path);
      const has = (list: unknown[], x: unknown) => list.some((y) => same(x, y, ignore));
      // What they kept or added, less what I removed; then what I added.
      const kept = t.filter((x) => !(has(b, x) && !has(m, x)));
      return [...kept, ...m.filter((x) => !has(b, x) && !has(t, x))];
    }
    if (isObject(b) && isObject(m) && isObject(t)) {
      const out: Record<string, unknown> = {};
      for (const k of new Set([...Object.keys(m), ...Object.keys(t)])) {
        out[k] = ignore.has(k) ? (k in m ? m[k] : t[k]) : walk(b[k], m[k], t[k], join(path, k), k);
      }
      return out;
    }
    if (Array.isArray(b) && Array.isArray(m) && Array.isArray(t)) {
      if (b.length === m.length && m.length === t.length)
        return m.map((x, i) => walk(b[i], x, t[i], join(path, String(i)), key));
    }
    theirChanges.push(path);
    conflicts.push({ path, base: b, mine: m, theirs: t });
    return m;
  };

  const merged = walk(base, mine, theirs, '', '') as T;
  return { merged, conflicts, theirChanges };
}

const join = (path: string, key: string) => (path ? `${path}.${key}` : key);

/** Sets the value at a dotted path in a copy of the document. */
function setAt<T>(doc: T, path: string, value: unknown): T {
  if (!path) return value as T;
  const [head, ...rest] = path.split('.');
  if (Array.isArray(doc)) {
    const copy = doc.slice();
    copy[Number(head)] = setAt(copy[Number(head)], rest.join('.'), value);
    return copy as T;
  }
  const obj = { ...(doc as Record<string, unknown>) };
  obj[head] = setAt(obj[head], rest.join('.'), value);
  return obj as T;
}

/** The merge with every conflict settled one way: 'mine' keeps this page's values. */
export function resolveConflicts<T>(result: MergeResult<T>, side: 'mine' | 'theirs'): T {
  if (side === 'mine') return result.merged;
  return result.conflicts.reduce((doc, c) => setAt(doc, c.path, c.theirs), result.merged);
}

const LABELS: Record<string, string> = {
  title: 'Title',
  styleSlug: 'Style',
  style: 'Style',
  makeDate: 'Make date',
  status: 'Draft or published',
  visibility: 'Who can see it',
  wheelStatus: 'Where the wheel is',
  milk: 'Milk',
  mould: 'Mould',
  rindTreatment: 'Rind',
  dryingDays: 'Drying days',
  aging: 'Aging',
  greenWeightKg: 'Green weight',
  greenWeight: 'Green weight',
  notes: 'Notes',
  ingredients: 'Ingredient',
  steps: 'Step',
  pressStages: 'Press stage',
  weighIns: 'Weigh-ins',
};

const words = (key: string) =>
  key
    .replace(/(Kg|C|Mm|L|N)$/, '')
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .toLowerCase();

/** A path as a maker reads it: "steps.2.actualMinutes" is "Step 3: actual minutes". */
export function describePath(path: string): string {
  const [head, ...rest] = path.split('.');
  const label = LABELS[head] ?? words(head);
  if (!rest.length) return label;
  if (/^\d+$/.test(rest[0])) {
    const item = `${label} ${Number(rest[0]) + 1}`;
    return rest.length > 1 ? `${item}: ${words(rest.slice(1).join(' '))}` : item;
  }
  return `${label}: ${words(rest.join(' '))}`;
}

/** A value as a short line for the comparison ("—" for nothing). */
export function describeValue(value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/.test(value)) {
    const at = new Date(value);
    if (!Number.isNaN(at.getTime()))
      return at.toLocaleString(undefined, {
        day: 'numeric',
        month: 'short',
        hour: '2-digit',
        minute: '2-digit',
      });
  }
  if (typeof value === 'string') return value.length > 80 ? `${value.slice(0, 79)}…` : value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  const text = JSON.stringify(value, (k, v) => (k === 'key' ? undefined : v));
  return text.length > 80 ? `${text.slice(0, 79)}…` : text;
}

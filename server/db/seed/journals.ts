// The demo club's journals: invented batches made from a few style templates with a fixed
// pseudo-random spread (salt, colouring, cook temperature, press loads, aging), so the demo
// has something to compare. Every value is made up for the demo; none is a recipe to follow.
import type { JournalInput } from '../../../shared/schemas/journal';
import { journalInputSchema } from '../../../shared/schemas/journal';
import type { StepKind } from '../../../shared/constants/journal';
import { toLitres, toNewtons } from '../../../shared/trade/units';

/** A small deterministic generator (mulberry32), so every fresh seed is the same. */
export function prng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Rand = () => number;
const between = (r: Rand, lo: number, hi: number) => lo + (hi - lo) * r();
// Rounded to the step, and cleaned of binary noise (4.1000000000000005 → 4.1).
const round = (v: number, step: number) => Number((Math.round(v / step) * step).toFixed(6));

type StepPlan = {
  kind: StepKind;
  tempC?: number;
  minutes?: number;
  cutSizeMm?: number;
  note?: string;
};

type Template = {
  styleSlug: string;
  titles: string[];
  milkL: [number, number];
  species: JournalInput['milk']['species'];
  rind: JournalInput['rindTreatment'];
  mouldMm: number;
  pressKgf: number[];
  pressMinutes: number[];
  agingDays: [number, number];
  caveC: number;
  humidity: number;
  dryingDays: number;
  saltGPerL: [number, number];
  colourDropsPerL?: [number, number];
  cultureGPerL: number;
  yieldFraction: [number, number];
  steps: StepPlan[];
  notes: string;
};

const CHEDDAR_STEPS: StepPlan[] = [
  { kind: 'warming', tempC: 31, minutes: 20 },
  { kind: 'ripening', tempC: 31, minutes: 45 },
  { kind: 'colouring', tempC: 31, minutes: 2 },
  { kind: 'coagulation', tempC: 31, minutes: 45 },
  { kind: 'cutting', tempC: 31, minutes: 5, cutSizeMm: 12 },
  { kind: 'healing', tempC: 31, minutes: 5 },
  { kind: 'cooking', tempC: 38, minutes: 40, note: 'Raised slowly, stirring gently.' },
  { kind: 'stirring', tempC: 38, minutes: 30 },
  { kind: 'draining', tempC: 38, minutes: 10 },
  { kind: 'cheddaring', tempC: 37, minutes: 90, note: 'Slabs turned every 15 minutes.' },
  { kind: 'milling', minutes: 10 },
  { kind: 'salting', minutes: 10 },
  { kind: 'hooping', minutes: 5 },
  { kind: 'pressing' },
];

const TEMPLATES: Template[] = [
  {
    styleSlug: 'cheddar',
    titles: [
      'Farmhouse cheddar',
      'Autumn cheddar',
      'Kitchen cheddar',
      'Winter cheddar',
      'Cheddar for the long shelf',
    ],
    milkL: [15, 19],
    species: 'cow',
    rind: 'waxed',
    mouldMm: 203,
    pressKgf: [5, 10, 20, 23],
    pressMinutes: [15, 30, 120, 720],
    agingDays: [90, 240],
    caveC: 11,
    humidity: 85,
    dryingDays: 3,
    saltGPerL: [1.6, 2.6],
    colourDropsPerL: [0, 1.2],
    cultureGPerL: 0.025,
    yieldFraction: [0.095, 0.115],
    steps: CHEDDAR_STEPS,
    notes:
      'Milk from the **Hollow Lane** herd, collected the same morning.\n\nThe curd knit well during cheddaring; slabs felt like cooked chicken breast by the end.',
  },
  {
    styleSlug: 'stirred-curd-cheddar',
    titles: ['Stirred-curd weekday batch', 'Quick stirred cheddar', 'Stirred curd, second try'],
    milkL: [11, 15],
    species: 'cow',
    rind: 'vacuum-sealed',
    mouldMm: 165,
    pressKgf: [5, 12, 22],
    pressMinutes: [20, 60, 720],
    agingDays: [60, 150],
    caveC: 10,
    humidity: 80,
    dryingDays: 2,
    saltGPerL: [1.5, 2.4],
    colourDropsPerL: [0.3, 1],
    cultureGPerL: 0.025,
    yieldFraction: [0.095, 0.11],
    steps: CHEDDAR_STEPS.filter((s) => s.kind !== 'cheddaring' && s.kind !== 'milling'),
    notes: 'Kept the curd moving instead of stacking slabs. Stirred until the whey ran clear.',
  },
  {
    styleSlug: 'gouda',
    titles: ['Washed-curd wheel', 'Gouda-type from the north pasture', 'Little gouda'],
    milkL: [10, 16],
    species: 'cow',
    rind: 'waxed',
    mouldMm: 180,
    pressKgf: [4, 8, 12],
    pressMinutes: [30, 60, 360],
    agingDays: [60, 180],
    caveC: 12,
    humidity: 85,
    dryingDays: 4,
    saltGPerL: [1.0, 1.8],
    cultureGPerL: 0.02,
    yieldFraction: [0.1, 0.12],
    steps: [
      { kind: 'warming', tempC: 32, minutes: 20 },
      { kind: 'ripening', tempC: 32, minutes: 30 },
      { kind: 'coagulation', tempC: 32, minutes: 40 },
      { kind: 'cutting', minutes: 5, cutSizeMm: 10 },
      { kind: 'stirring', tempC: 32, minutes: 15 },
      {
        kind: 'draining',
        minutes: 5,
        note: 'Took off a third of the whey and replaced it with hot water.',
      },
      { kind: 'cooking', tempC: 37, minutes: 30 },
      { kind: 'hooping', minutes: 10 },
      { kind: 'pressing' },
      { kind: 'salting', minutes: 480, note: 'Brined overnight.' },
    ],
    notes: 'Curd washed with water at 60 °C to lower the acid. Brine at about 20 % salt.',
  },
  {
    styleSlug: 'tomme',
    titles: ['Hill tomme', 'Natural-rind tomme', 'Cellar tomme'],
    milkL: [12, 20],
    species: 'cow',
    rind: 'natural',
    mouldMm: 200,
    pressKgf: [3, 6, 10],
    pressMinutes: [30, 60, 480],
    agingDays: [60, 150],
    caveC: 12,
    humidity: 90,
    dryingDays: 2,
    saltGPerL: [1.2, 2.2],
    cultureGPerL: 0.02,
    yieldFraction: [0.095, 0.115],
    steps: [
      { kind: 'warming', tempC: 33, minutes: 20 },
      { kind: 'ripening', tempC: 33, minutes: 40 },
      { kind: 'coagulation', tempC: 33, minutes: 45 },
      { kind: 'cutting', minutes: 5, cutSizeMm: 10 },
      { kind: 'cooking', tempC: 36, minutes: 30 },
      { kind: 'hooping', minutes: 10 },
      { kind: 'pressing' },
      { kind: 'salting', minutes: 10, note: 'Dry-salted the surface.' },
      { kind: 'rind-treatment', note: 'Brushed weekly.' },
    ],
    notes: 'Rind left to grow its own grey coat; brushed every week.',
  },
  {
    styleSlug: 'caerphilly',
    titles: ['Crumbly miner-style cheese', 'Young crumbly wheel'],
    milkL: [8, 12],
    species: 'cow',
    rind: 'natural',
    mouldMm: 150,
    pressKgf: [4, 8],
    pressMinutes: [60, 600],
    agingDays: [21, 60],
    caveC: 11,
    humidity: 85,
    dryingDays: 1,
    saltGPerL: [1.8, 2.8],
    cultureGPerL: 0.02,
    yieldFraction: [0.1, 0.12],
    steps: [
      { kind: 'warming', tempC: 32, minutes: 15 },
      { kind: 'ripening', tempC: 32, minutes: 30 },
      { kind: 'coagulation', tempC: 32, minutes: 40 },
      { kind: 'cutting', minutes: 5, cutSizeMm: 15 },
      { kind: 'cooking', tempC: 34, minutes: 20 },
      { kind: 'draining', minutes: 10 },
      { kind: 'hooping', minutes: 5 },
      { kind: 'pressing' },
      { kind: 'salting', minutes: 720, note: 'Brined overnight.' },
    ],
    notes: 'A fast make, done by lunchtime.',
  },
  {
    styleSlug: 'pecorino',
    titles: ["Shepherd's wheel", "Sheep's milk hard cheese"],
    milkL: [8, 12],
    species: 'sheep',
    rind: 'oiled',
    mouldMm: 160,
    pressKgf: [4, 8, 12],
    pressMinutes: [30, 60, 480],
    agingDays: [90, 240],
    caveC: 11,
    humidity: 85,
    dryingDays: 3,
    saltGPerL: [2.0, 3.0],
    cultureGPerL: 0.03,
    yieldFraction: [0.15, 0.19],
    steps: [
      { kind: 'warming', tempC: 36, minutes: 20 },
      { kind: 'ripening', tempC: 36, minutes: 30 },
      { kind: 'coagulation', tempC: 36, minutes: 30 },
      { kind: 'cutting', minutes: 5, cutSizeMm: 6 },
      { kind: 'cooking', tempC: 43, minutes: 30 },
      { kind: 'hooping', minutes: 10 },
      { kind: 'pressing' },
      { kind: 'salting', minutes: 10, note: 'Dry-salted on both faces, three days running.' },
      { kind: 'rind-treatment', note: 'Rubbed with olive oil.' },
    ],
    notes: "Milk from a neighbour's small flock. Rich and quick to set.",
  },
  {
    styleSlug: 'camembert',
    titles: ['Little bloomy rounds', 'White-mould rounds'],
    milkL: [6, 9],
    species: 'cow',
    rind: 'natural',
    mouldMm: 110,
    pressKgf: [],
    pressMinutes: [],
    agingDays: [28, 50],
    caveC: 11,
    humidity: 92,
    dryingDays: 2,
    saltGPerL: [1.4, 2.0],
    cultureGPerL: 0.02,
    yieldFraction: [0.11, 0.13],
    steps: [
      { kind: 'warming', tempC: 32, minutes: 20 },
      { kind: 'ripening', tempC: 32, minutes: 60 },
      { kind: 'coagulation', tempC: 32, minutes: 70 },
      { kind: 'cutting', minutes: 5, cutSizeMm: 20 },
      { kind: 'hooping', minutes: 30, note: 'Ladled into the moulds.' },
      { kind: 'draining', minutes: 720, note: 'Turned three times.' },
      { kind: 'salting', minutes: 5 },
    ],
    notes: 'Unpressed. Wrapped once the white coat covered the rounds.',
  },
  {
    styleSlug: 'feta',
    titles: ['Brined goat blocks', 'Market feta-type'],
    milkL: [8, 12],
    species: 'goat',
    rind: 'other',
    mouldMm: 120,
    pressKgf: [],
    pressMinutes: [],
    agingDays: [30, 60],
    caveC: 8,
    humidity: 95,
    dryingDays: 1,
    saltGPerL: [2.5, 3.5],
    cultureGPerL: 0.02,
    yieldFraction: [0.13, 0.16],
    steps: [
      { kind: 'warming', tempC: 31, minutes: 15 },
      { kind: 'ripening', tempC: 31, minutes: 60 },
      { kind: 'coagulation', tempC: 31, minutes: 50 },
      { kind: 'cutting', minutes: 5, cutSizeMm: 20 },
      { kind: 'stirring', minutes: 20 },
      { kind: 'hooping', minutes: 10 },
      { kind: 'draining', minutes: 1200 },
      { kind: 'salting', note: 'Cut into blocks, salted, then into brine.' },
    ],
    notes: 'Kept in an 8 % brine in the cold room.',
  },
];

export type DemoJournal = { makerHandle: string; doc: JournalInput; ageDays: number };

const HANDLES = ['odile', 'tobiah', 'marit', 'casimir', 'juna'];

/** The club's journals (26), made `ageDays` before today; every document passes the shared schema. */
export function demoJournals(today = new Date()): DemoJournal[] {
  const r = prng(20260314);
  const out: DemoJournal[] = [];
  const plan: Array<[number, number]> = [
    // [template index, count]
    [0, 7],
    [1, 3],
    [2, 3],
    [3, 3],
    [4, 2],
    [5, 3],
    [6, 3],
    [7, 2],
  ];
  let n = 0;
  for (const [ti, count] of plan) {
    const tpl = TEMPLATES[ti];
    for (let k = 0; k < count; k++, n++) {
      const makerHandle =
        tpl.species === 'sheep'
          ? 'casimir'
          : tpl.species === 'goat'
            ? 'tobiah'
            : HANDLES[n % HANDLES.length];
      // Spread makes over the last ten months; the sixth journal is four months old to the day.
      const ageDays = n === 5 ? 122 : Math.round(between(r, 8, 300));
      const make = new Date(today.getTime() - ageDays * 86_400_000);
      const makeDate = make.toISOString().slice(0, 10);
      const milkL = round(between(r, tpl.milkL[0], tpl.milkL[1]), 0.5);
      const usUnits = makerHandle === 'tobiah' || makerHandle === 'casimir';
      const raw = tpl.species !== 'cow' ? r() < 0.6 : r() < 0.35;
      const saltG = round(between(r, tpl.saltGPerL[0], tpl.saltGPerL[1]) * milkL, 1);
      const colourDrops = tpl.colourDropsPerL
        ? Math.round(between(r, tpl.colourDropsPerL[0], tpl.colourDropsPerL[1]) * milkL)
        : 0;
      const cookShift = between(r, -1.2, 1.5);
      const targetDays = Math.round(between(r, tpl.agingDays[0], tpl.agingDays[1]) / 7) * 7;
      let clock = make.getTime() + 7 * 3_600_000; // the make starts at 07:00 UTC
      const steps = tpl.steps.map((s) => {
        const target =
          s.tempC !== undefined
            ? s.tempC + (s.kind === 'cooking' || s.kind === 'stirring' ? cookShift : 0)
            : null;
        const actualMinutes =
          s.minutes !== undefined
            ? Math.max(1, Math.round(s.minutes * between(r, 0.85, 1.25)))
            : null;
        const startedAt = new Date(clock).toISOString();
        clock += (actualMinutes ?? 30) * 60_000;
        return {
          kind: s.kind,
          targetTempC: target === null ? null : round(target, 0.5),
          actualTempC: target === null ? null : round(target + between(r, -0.6, 0.6), 0.1),
          targetMinutes: s.minutes ?? null,
          actualMinutes,
          startedAt,
          cutSizeMm: s.cutSizeMm ?? null,
          note: s.note ?? '',
        };
      });
      const milkKg = milkL * 1.03;
      const greenKg = round(
        milkKg * between(r, tpl.yieldFraction[0], tpl.yieldFraction[1]) * 1.08,
        0.005,
      );
      const weighIns: JournalInput['weighIns'] = [];
      const weeks = Math.min(Math.floor(ageDays / 7), 20);
      let mass = greenKg;
      for (let w = 0; w <= weeks; w += w < 4 ? 1 : 3) {
        const date = new Date(make.getTime() + (w * 7 + 1) * 86_400_000).toISOString().slice(0, 10);
        weighIns.push({
          date,
          massKg: round(mass, 0.005),
          note: w === 0 ? 'Green weight, out of the press.' : '',
        });
        mass *= 1 - between(r, 0.006, 0.02) * (w < 4 ? 1 : 2.2);
      }
      const wheelStatus: JournalInput['wheelStatus'] =
        ageDays < 3
          ? 'pressing'
          : ageDays < 3 + tpl.dryingDays
            ? 'drying'
            : ageDays >= targetDays + 20 && r() < 0.7
              ? 'opened'
              : 'aging';
      const doc = journalInputSchema.parse({
        title:
          k < tpl.titles.length
            ? tpl.titles[k]
            : `${tpl.titles[k % tpl.titles.length]}, ${make.toLocaleString('en-GB', { month: 'long', timeZone: 'UTC' })} batch`,
        styleSlug: tpl.styleSlug,
        makeDate,
        status: n % 9 === 8 ? 'draft' : 'published',
        visibility: n % 11 === 10 ? 'private' : n % 13 === 12 ? 'unlisted' : 'public',
        wheelStatus,
        milk: {
          volumeL: usUnits ? toLitres(round(milkL / 3.785411784, 0.5), 'gal') : milkL,
          volumeUnit: usUnits ? 'gal' : 'L',
          species: tpl.species,
          heatTreatment: raw
            ? 'raw'
            : tpl.species === 'cow' && r() < 0.3
              ? 'thermised'
              : 'pasteurised',
          homogenised: false,
          fatPercent:
            tpl.species === 'sheep'
              ? round(between(r, 6, 7.5), 0.1)
              : round(between(r, 3.4, 4.4), 0.1),
          proteinPercent:
            tpl.species === 'sheep'
              ? round(between(r, 5.2, 6.2), 0.1)
              : round(between(r, 3.1, 3.6), 0.1),
        },
        mould: {
          shape: 'round',
          diameterMm: tpl.mouldMm,
          lengthMm: null,
          widthMm: null,
          unit: usUnits ? 'in' : 'mm',
        },
        rindTreatment: tpl.rind,
        dryingDays: tpl.dryingDays,
        aging: { targetDays, tempC: tpl.caveC, humidityPercent: tpl.humidity, checkDate: null },
        greenWeightKg: greenKg,
        notes: tpl.notes,
        ingredients: [
          {
            kind: 'culture',
            name: 'Mesophilic starter (freeze-dried)',
            amount: round(tpl.cultureGPerL * milkL, 0.05) || 0.1,
            unit: 'g',
            mlPerDrop: null,
            note: '',
          },
          ...(tpl.species === 'cow' && !raw
            ? [
                {
                  kind: 'calcium-chloride' as const,
                  name: 'Calcium chloride, 30 % solution',
                  amount: round(0.25 * milkL, 0.5),
                  unit: 'mL' as const,
                  mlPerDrop: null,
                  note: 'Diluted in cool water.',
                },
              ]
            : []),
          ...(colourDrops > 0
            ? [
                {
                  kind: 'colouring' as const,
                  name: 'Annatto',
                  amount: colourDrops,
                  unit: 'drop' as const,
                  mlPerDrop: 0.05,
                  note: '',
                },
              ]
            : []),
          {
            kind: 'rennet',
            name: 'Liquid calf rennet',
            amount: round(0.2 * milkL, 0.5),
            unit: 'mL',
            mlPerDrop: null,
            note: '',
          },
          {
            kind: 'salt',
            name: 'Flake cheese salt',
            amount: saltG,
            unit: 'g',
            mlPerDrop: null,
            note: '',
          },
        ],
        steps,
        pressStages: tpl.pressKgf.map((kgf, i) => {
          const load = round(kgf * between(r, 0.85, 1.25), 0.5);
          return usUnits
            ? {
                loadN: toNewtons(round(load * 2.20462, 1), 'lbf'),
                loadUnit: 'lbf',
                minutes: tpl.pressMinutes[i],
              }
            : { loadN: toNewtons(load, 'kgf'), loadUnit: 'kgf', minutes: tpl.pressMinutes[i] };
        }),
        weighIns,
      });
      out.push({ makerHandle, doc, ageDays });
    }
  }
  return out;
}

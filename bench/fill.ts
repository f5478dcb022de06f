// Fills a throwaway database with a community: members, journals and tastings with a
// realistic spread (popular styles more common, aging from each style's typical range,
// metric_* figures around trade values, overall liking tied loosely to salt and age).
// Multi-row INSERTs of a few thousand rows each, checks off, on one connection; Compare's
// facts then come from one INSERT … SELECT.
import { drizzle } from 'drizzle-orm/mysql2';
import type { Pool, PoolConnection } from 'mysql2/promise';
import { rebuildCompareFacts } from '../server/repositories/compare.repository';
import { STYLES } from '../shared/constants/styles';

export type FillSize = { members: number; journals: number; tastings: number; detailed: number };

export type FillResult = {
  ms: number;
  rows: Record<string, number>;
  /** Things the measurements need: a busy maker's handle, a detailed journal id, a word. */
  probes: { makerHandle: string; journalId: number; searchWord: string; styleSlug: string };
};

// A small deterministic generator, so two runs fill the same community.
function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let x = Math.imul(s ^ (s >>> 15), 1 | s);
    x = (x + Math.imul(x ^ (x >>> 7), 61 | x)) ^ x;
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
}

const WORDS = (
  'nutty buttery sharp creamy crumbly grassy earthy tangy sweet brothy fruity floral ' +
  'lactic mushroomy caramel smoky peppery salty supple firm open close-knit waxy curd whey ' +
  'rennet culture cave brine rind mould press wheel cheddaring milling hooping stirred washed'
).split(' ');

// A larger vocabulary with a Zipf spread, as real notes have: a few words everywhere, most
// words rare. Made from syllables, deterministically.
const SYLLABLES = ['ka', 'ro', 'mi', 'lu', 'ten', 'bar', 'sel', 'vo', 'dri', 'na', 'pol', 'ue'];
const VOCABULARY = Array.from({ length: 4000 }, (_, i) => {
  let n = i + 7;
  let word = '';
  while (n > 0) {
    word += SYLLABLES[n % SYLLABLES.length];
    n = Math.floor(n / SYLLABLES.length);
  }
  return `${word}ish`;
});

const ADJECTIVES = ['Farmhouse', 'Spring', 'Winter', 'Hill', 'Meadow', 'Cellar', 'Sunday', 'Late'];
const SPECIES = ['cow', 'cow', 'cow', 'cow', 'goat', 'goat', 'sheep', 'buffalo', 'mixed'];
const HEAT = ['pasteurised', 'pasteurised', 'pasteurised', 'raw', 'thermised'];
const RIND = ['natural', 'waxed', 'waxed', 'vacuum-sealed', 'cloth-bound', 'oiled', 'other'];

const BATCH = 4000;

async function insertRows(
  conn: PoolConnection,
  table: string,
  columns: string[],
  rows: unknown[][],
): Promise<void> {
  for (let i = 0; i < rows.length; i += BATCH) {
    await conn.query(`INSERT INTO ${table} (${columns.join(', ')}) VALUES ?`, [
      rows.slice(i, i + BATCH),
    ]);
  }
}

const pad = (n: number) => String(n).padStart(2, '0');
const isoDay = (d: Date) =>
  `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
const round = (value: number, places = 3) => Math.round(value * 10 ** places) / 10 ** places;

/** Fills the (migrated, empty) database; resolves with the time taken and the row counts. */
export async function fillCommunity(pool: Pool, size: FillSize): Promise<FillResult> {
  const started = performance.now();
  const random = rng(20260501);
  const pick = <T>(list: readonly T[]) => list[Math.floor(random() * list.length)];
  const normal = (mean: number, sd: number) => {
    const u = 1 - random();
    const v = random();
    return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
  const conn = await pool.getConnection();
  try {
    await conn.query('SET unique_checks = 0, foreign_key_checks = 0');
    const [styleRows] = (await conn.query('SELECT id, slug FROM styles ORDER BY sort_order')) as [
      { id: number; slug: string }[],
      unknown,
    ];
    const styles = styleRows.map((row) => ({
      ...row,
      def: STYLES.find((s) => s.slug === row.slug)!,
    }));
    // Popular styles first: a Zipf-like weight by position.
    const weights = styles.map((_, i) => 1 / (i + 1) ** 0.8);
    const totalWeight = weights.reduce((a, b) => a + b, 0);
    const pickStyle = () => {
      let r = random() * totalWeight;
      for (let i = 0; i < styles.length; i++) {
        r -= weights[i];
        if (r <= 0) return styles[i];
      }
      return styles[0];
    };

    // Members: a fixed (not real) hash, since nobody signs in during the benchmark.
    const hash = '$argon2id$v=19$m=19456,t=2,p=1$YmVuY2hzYWx0$YmVuY2hoYXNoYmVuY2hoYXNo';
    const members: unknown[][] = [];
    for (let i = 1; i <= size.members; i++) {
      members.push([
        i,
        `bench-${i}@example.test`,
        new Date('2025-01-01T00:00:00Z'),
        `bench-maker-${i}`,
        `Bench maker ${i}`,
        hash,
        i % 500 === 0 ? 'moderator' : 'member',
        i % 4 === 0 ? 'us' : 'metric',
      ]);
    }
    await insertRows(
      conn,
      'users',
      [
        'id',
        'email',
        'email_verified_at',
        'handle',
        'display_name',
        'password_hash',
        'role',
        'units',
      ],
      members,
    );

    // Makers are skewed too: a few prolific members, a long tail.
    const pickMaker = () => 1 + Math.floor(size.members * random() ** 2.2);
    const today = Date.UTC(2026, 4, 1);
    type J = {
      id: number;
      ageTarget: number;
      makeDay: number;
      salt: number;
      published: boolean;
      tastings: number[];
      lastAge: number | null;
    };
    const journals: J[] = [];
    const journalRows: unknown[][] = [];
    for (let id = 1; id <= size.journals; id++) {
      const style = pickStyle();
      const [minAge, maxAge] = style.def.agingDays;
      const ageTarget = Math.round(minAge + (maxAge - minAge) * random() ** 1.5);
      const makeDay = today - Math.floor(random() * 3 * 365) * 86_400_000;
      const status = random() < 0.06 ? 'draft' : 'published';
      const visRoll = random();
      const visibility = visRoll < 0.85 ? 'public' : visRoll < 0.92 ? 'unlisted' : 'private';
      const milk = round(Math.max(2, normal(12, 6)), 1);
      const salt = round(Math.max(0.5, normal(2.6, 0.7)));
      const yieldPercent = round(Math.max(4, normal(style.def.agingDays[1] > 200 ? 10 : 14, 2)), 2);
      const ageSoFar = Math.floor((today - makeDay) / 86_400_000);
      const wheelStatus = ageSoFar > ageTarget ? pick(['opened', 'finished', 'aging']) : 'aging';
      const words = [
        ...Array.from({ length: 4 }, () => pick(WORDS)),
        ...Array.from({ length: 8 }, () => VOCABULARY[Math.floor(4000 ** random()) - 1]),
      ].join(' ');
      journals.push({
        id,
        ageTarget,
        makeDay,
        salt,
        published: status === 'published' && visibility === 'public',
        tastings: [],
        lastAge: null,
      });
      journalRows.push([
        id,
        pickMaker(),
        style.id,
        `${pick(ADJECTIVES)} ${style.def.name} no. ${id}`,
        isoDay(new Date(makeDay)),
        status,
        visibility,
        wheelStatus,
        milk,
        pick(SPECIES),
        pick(HEAT),
        pick(RIND),
        round(Math.max(0, normal(1.5, 1)), 1),
        ageTarget,
        round(normal(11, 1.5), 1),
        round(normal(85, 5), 1),
        round(milk * yieldPercent * 0.01, 3),
        `A ${words}. Made on a ${pick(WORDS)} day with ${pick(WORDS)} milk.`,
        random() < 0.01 ? new Date('2026-04-01T00:00:00Z') : null,
        salt,
        round(salt / Math.max(0.1, yieldPercent * 0.1), 3),
        round(Math.max(0, normal(0.08, 0.03)), 4),
        round(Math.max(0, normal(0.2, 0.05)), 4),
        round(Math.max(0.005, normal(0.02, 0.006)), 4),
        round(normal(31, 1.5), 2),
        round(normal(38, 2.5), 2),
        round(Math.max(0.2, normal(1, 0.3)), 3),
        round(Math.max(1, normal(40, 15)), 2),
        yieldPercent,
        round(Math.max(0, normal(8, 3)), 2),
        status === 'published' ? new Date(makeDay + 86_400_000) : null,
      ]);
    }

    // Tastings: most published journals get a few, popular ones many, some none.
    const tastingRows: unknown[][] = [];
    let tid = 0;
    while (tid < size.tastings) {
      const j = journals[Math.floor(size.journals * random() ** 1.3)];
      const maxAge = Math.floor((today - j.makeDay) / 86_400_000);
      if (maxAge < 1) continue;
      tid += 1;
      const ageDays = Math.max(1, Math.min(maxAge, Math.round(j.ageTarget * (0.5 + random()))));
      const base = 5.5 + 0.7 * (j.salt - 2.6) + 0.002 * Math.min(ageDays, 400) + normal(0, 1.2);
      const score = (offset: number) => Math.max(1, Math.min(9, Math.round(base + offset)));
      const overall = score(0);
      const hidden = random() < 0.01;
      if (!hidden) {
        j.tastings.push(overall);
        j.lastAge = Math.max(j.lastAge ?? 0, ageDays);
      }
      tastingRows.push([
        tid,
        j.id,
        pickMaker(),
        isoDay(new Date(j.makeDay + ageDays * 86_400_000)),
        ageDays,
        overall,
        score(normal(0, 0.8)),
        score(normal(0, 0.8)),
        score(normal(0, 0.8)),
        score(normal(0, 0.8)),
        score(normal(0, 0.8)),
        '["nutty"]',
        '[]',
        '',
        hidden ? new Date('2026-04-01T00:00:00Z') : null,
      ]);
    }
    // The stored aggregates, as the tastings service keeps them.
    journalRows.forEach((row, i) => {
      const j = journals[i];
      const n = j.tastings.length;
      row.push(n, n ? j.tastings.reduce((a, b) => a + b, 0) / n : null, j.lastAge);
    });
    await insertRows(
      conn,
      'journals',
      [
        'id',
        'user_id',
        'style_id',
        'title',
        'make_date',
        'status',
        'visibility',
        'wheel_status',
        'milk_volume_l',
        'species',
        'heat_treatment',
        'rind_treatment',
        'drying_days',
        'aging_target_days',
        'aging_temp_c',
        'aging_humidity_percent',
        'green_weight_kg',
        'notes',
        'hidden_at',
        'metric_salt_g_per_l',
        'metric_salt_percent',
        'metric_colour_ml_per_l',
        'metric_calcium_chloride_ml_per_l',
        'metric_culture_g_per_l',
        'metric_coagulation_temp_c',
        'metric_cook_temp_c',
        'metric_cook_ramp_c_per_5min',
        'metric_press_max_kpa',
        'metric_yield_percent',
        'metric_moisture_loss_percent',
        'published_at',
        'tasting_count',
        'mean_overall',
        'last_tasted_age_days',
      ],
      journalRows,
    );
    await insertRows(
      conn,
      'tastings',
      [
        'id',
        'journal_id',
        'taster_id',
        'tasted_on',
        'age_days',
        'overall',
        'appearance',
        'aroma',
        'flavour',
        'texture',
        'finish',
        'descriptors',
        'defects',
        'notes',
        'hidden_at',
      ],
      tastingRows,
    );

    // Whole documents (ingredients, steps, press stages, weigh-ins) for the first journals,
    // so a journal read does its real work.
    const ingredients: unknown[][] = [];
    const steps: unknown[][] = [];
    const stages: unknown[][] = [];
    const weighIns: unknown[][] = [];
    for (let id = 1; id <= size.detailed; id++) {
      const milk = journalRows[id - 1][8] as number;
      ingredients.push(
        [id, 0, 'culture', 'Mesophilic culture', 0.6, 'g', null, 0.0006, 'mass', ''],
        [id, 1, 'calcium-chloride', 'Calcium chloride', 2.5, 'mL', null, 0.0025, 'volume', ''],
        [id, 2, 'rennet', 'Calf rennet', 3, 'mL', null, 0.003, 'volume', ''],
        [id, 3, 'salt', 'Flake salt', round(milk * 2.6, 1), 'g', null, milk * 0.0026, 'mass', ''],
      );
      ['warming', 'ripening', 'coagulation', 'cutting', 'cooking', 'draining'].forEach((kind, p) =>
        steps.push([
          id,
          p,
          kind,
          31 + p,
          31 + p,
          30,
          30 + p,
          null,
          kind === 'cutting' ? 12 : null,
          '',
        ]),
      );
      [45, 90, 180].forEach((load, p) => stages.push([id, p, load, 'N', 30 * (p + 1)]));
      const make = journals[id - 1].makeDay;
      [0, 7, 30].forEach((d) =>
        weighIns.push([
          id,
          isoDay(new Date(make + d * 86_400_000)),
          round(milk * 0.1 * (1 - d / 300)),
          '',
        ]),
      );
    }
    await insertRows(
      conn,
      'journal_ingredients',
      [
        'journal_id',
        'position',
        'kind',
        'name',
        'amount',
        'unit',
        'ml_per_drop',
        'si_value',
        'si_dimension',
        'note',
      ],
      ingredients,
    );
    await insertRows(
      conn,
      'journal_steps',
      [
        'journal_id',
        'position',
        'kind',
        'target_temp_c',
        'actual_temp_c',
        'target_minutes',
        'actual_minutes',
        'started_at',
        'cut_size_mm',
        'note',
      ],
      steps,
    );
    await insertRows(
      conn,
      'journal_press_stages',
      ['journal_id', 'position', 'load_n', 'load_unit', 'minutes'],
      stages,
    );
    await insertRows(
      conn,
      'journal_weigh_ins',
      ['journal_id', 'date', 'mass_kg', 'note'],
      weighIns,
    );
    // Compare's facts in one INSERT … SELECT over what was just loaded, as the migration does.
    await rebuildCompareFacts(drizzle(conn));
    await conn.query('SET unique_checks = 1, foreign_key_checks = 1');
    await conn.query('ANALYZE TABLE users, journals, tastings, compare_facts');

    return {
      ms: performance.now() - started,
      rows: {
        users: members.length,
        journals: journalRows.length,
        tastings: tastingRows.length,
        journal_ingredients: ingredients.length,
        journal_steps: steps.length,
        journal_press_stages: stages.length,
        journal_weigh_ins: weighIns.length,
      },
      probes: await findProbes(conn),
    };
  } finally {
    conn.release();
  }
}

/**
 * What the benchmark asks for, read from a filled database (so a kept one can be measured
 * again): the busiest maker, the first listed journal with its make day's steps (the
 * detailed ones), a word of the titles' vocabulary, the first style.
 */
export async function findProbes(conn: PoolConnection | Pool): Promise<FillResult['probes']> {
  const [[busy]] = (await conn.query(
    `SELECT u.handle FROM journals j JOIN users u ON u.id = j.user_id
     WHERE j.status = 'published' AND j.visibility = 'public' AND j.hidden_at IS NULL
     GROUP BY u.id ORDER BY COUNT(*) DESC LIMIT 1`,
  )) as [{ handle: string }[], unknown];
  const [[detailed]] = (await conn.query(
    `SELECT MIN(j.id) AS id FROM journals j
     WHERE j.status = 'published' AND j.visibility = 'public' AND j.hidden_at IS NULL
       AND EXISTS (SELECT 1 FROM journal_steps s WHERE s.journal_id = j.id)`,
  )) as [{ id: number | null }[], unknown];
  const [[style]] = (await conn.query('SELECT slug FROM styles ORDER BY sort_order LIMIT 1')) as [
    { slug: string }[],
    unknown,
  ];
  return {
    makerHandle: busy.handle,
    journalId: detailed.id ?? 1,
    searchWord: VOCABULARY[150],
    styleSlug: style.slug,
  };
}

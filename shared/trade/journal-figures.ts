// A whole journal's derived figures, composed from the trade library: the numbers stored in
// the journals.metric_* columns (for Discover and Compare) and the fuller set a journal page
// shows. Pure functions on SI values; the server runs them on every save, and the client may
// run them on an unsaved draft for a live preview.

import type { DerivedFiguresDto } from '../types/journal';
import {
  CUT_WHEEL_STATUSES,
  cutOn,
  RAW_MILK_LOCAL_RULES,
  RAW_MILK_SALE_RULE,
  RAW_MILK_WHO_SHOULD_AVOID,
  ageInDays,
  daysToTarget,
  rawMilkCaution,
  rawMilkReadyCheck,
  readyDate,
} from './aging';
import { milkDensity, milkMassKg } from './milk';
import type { MilkSpecies } from './milk';
import { moistureLossSeries } from './moisture';
import type { MouldFace } from './pressure';
import { pressSchedulePressures } from './pressure';
import { checkHeatingRamp, DEFAULT_RAMP_LIMIT_C_PER_5_MIN } from './ramp';
import { ratePerLitreOfMilk, saltPercentOfCurd } from './salt';
import { formatNumber } from './format';
import { CHEDDAR_STANDARD } from './standards';
import { amountDimension, amountToLitres, amountToSi } from './units';
import type { AmountUnit } from './units';
import { DEFAULT_CASEIN_FRACTION, vanSlykeYield, yieldEfficiency, yieldPercent } from './yield';

/** Moisture assumed for the Van Slyke prediction: a typical cheddar, % (cheese-science texts). */
export const PREDICTION_MOISTURE_PERCENT = 37;

/** What the figures are worked out from: the journal document in SI, plus its vat readings. */
export interface JournalFiguresInput {
  /** ISO date of the make, "YYYY-MM-DD" */
  makeDate: string;
  milk: {
    volumeL: number;
    species: string;
    heatTreatment: string;
    fatPercent: number | null;
    proteinPercent: number | null;
  };
  mould: {
    shape: 'round' | 'rectangular';
    diameterMm: number | null;
    lengthMm: number | null;
    widthMm: number | null;
  };
  ingredients: readonly {
    kind: string;
    amount: number;
    unit: AmountUnit;
    mlPerDrop: number | null;
  }[];
  steps: readonly { kind: string; targetTempC: number | null; actualTempC: number | null }[];
  pressStages: readonly { loadN: number; minutes: number }[];
  greenWeightKg: number | null;
  weighIns: readonly { date: string; massKg: number }[];
  readings: readonly { takenAt: string | Date; tempC: number | null; stepIndex: number | null }[];
  /** openedOn and wheelStatus stop the age at the day the wheel was cut (opened, finished). */
  aging: { targetDays: number | null; openedOn?: string | null; wheelStatus?: string };
}

/** The figures kept in the journals.metric_* columns (null where the journal lacks the data). */
export interface JournalMetrics {
  saltGPerL: number | null;
  saltPercent: number | null;
  colourMlPerL: number | null;
  calciumChlorideMlPerL: number | null;
  cultureGPerL: number | null;
  coagulationTempC: number | null;
  cookTempC: number | null;
  cookRampCPer5Min: number | null;
  pressMaxKpa: number | null;
  yieldPercent: number | null;
  moistureLossPercent: number | null;
}

const finiteOrNull = (value: number | null | undefined): number | null =>
  value === null || value === undefined || !Number.isFinite(value) ? null : value;

// The journal vocabulary has 'mixed'; the milk table knows 'other' (cow's density stands in).
function milkSpecies(species: string): MilkSpecies {
  return species === 'cow' || species === 'goat' || species === 'sheep' || species === 'buffalo'
    ? species
    : 'other';
}

/** Returns the mould face for the pressure formulas, or null when its size is not known. */
export function mouldFace(mould: JournalFiguresInput['mould']): MouldFace | null {
  if (mould.shape === 'round' && mould.diameterMm !== null && mould.diameterMm > 0) {
    return { shape: 'round', diameterMm: mould.diameterMm };
  }
  if (
    mould.shape === 'rectangular' &&
    mould.lengthMm !== null &&
    mould.widthMm !== null &&
    mould.lengthMm > 0 &&
    mould.widthMm > 0
  ) {
    return { shape: 'rectangular', lengthMm: mould.lengthMm, widthMm: mould.widthMm };
  }
  return null;
}

// Total of one kind of ingredient by mass in kg; null unless every entry of that kind was
// weighed (a spoonful cannot be added to grams without a density).
function totalMassKg(input: JournalFiguresInput, kind: string): number | null {
  const items = input.ingredients.filter((i) => i.kind === kind);
  if (!items.length || items.some((i) => amountDimension(i.unit) !== 'mass')) return null;
  return items.reduce((sum, i) => sum + amountToSi(i.amount, i.unit).value, 0);
}

// Total of one kind of ingredient as a volume in L: volumes as they are, drops at the mL per
// drop the maker stated; null when an entry was weighed or a drop size is missing.
function totalVolumeL(input: JournalFiguresInput, kind: string): number | null {
  const items = input.ingredients.filter((i) => i.kind === kind);
  if (!items.length) return null;
  let litres = 0;
  for (const i of items) {
    const dimension = amountDimension(i.unit);
    if (dimension === 'mass') return null;
    if (dimension === 'count' && !(i.mlPerDrop && i.mlPerDrop > 0)) return null;
    litres += amountToLitres(i.amount, i.unit, i.mlPerDrop ?? undefined);
  }
  return litres;
}

function perLitre(
  amount: number | null,
  dimension: 'mass' | 'volume',
  milkL: number,
): number | null {
  if (amount === null || !(milkL > 0)) return null;
  return ratePerLitreOfMilk({ dimension, value: amount }, milkL).value;
}

const stepTemp = (s: { targetTempC: number | null; actualTempC: number | null }) =>
  s.actualTempC ?? s.targetTempC;

// The readings of the cook: those logged against a cooking step when any are; otherwise all
// temperature readings (a maker who did not tag them still gets a check).
function cookReadings(input: JournalFiguresInput) {
  const cookingSteps = new Set(
    input.steps.flatMap((s, index) => (s.kind === 'cooking' ? [index] : [])),
  );
  const withTemp = input.readings.filter(
    (r): r is typeof r & { tempC: number } => r.tempC !== null && Number.isFinite(r.tempC),
  );
  const tagged = withTemp.filter((r) => r.stepIndex !== null && cookingSteps.has(r.stepIndex));
  return (tagged.length ? tagged : withTemp).map((r) => ({ at: r.takenAt, tempC: r.tempC }));
}

function greenAndLatest(input: JournalFiguresInput) {
  const series = weighInSeries(input);
  const latest = series.length ? series[series.length - 1] : null;
  return { series, latest };
}

// Weigh-ins in date order with the green weight (when given) as the first point, on the make
// date: moistureLossSeries takes its first point as the green cheese.
function weighInSeries(input: JournalFiguresInput) {
  const points = input.weighIns.map((w) => ({ at: w.date, kg: w.massKg, green: false }));
  if (input.greenWeightKg !== null && input.greenWeightKg > 0) {
    points.unshift({ at: input.makeDate, kg: input.greenWeightKg, green: true });
  }
  if (!points.length) return [];
  const computed = moistureLossSeries(points);
  // moistureLossSeries sorts by time; keep which point is the synthetic green weight.
  const order = points
    .map((p, index) => ({ p, index, ms: Date.parse(`${p.at}T00:00:00Z`) }))
    .sort((a, b) => a.ms - b.ms || a.index - b.index);
  return computed.map((point, i) => ({ ...point, green: order[i].p.green, date: order[i].p.at }));
}

/** Returns the journal's stored figures from shared/trade (see each column; SI and %). */
export function journalMetrics(input: JournalFiguresInput): JournalMetrics {
  const milkL = input.milk.volumeL;
  const milkKg = milkMassKg(milkL, milkSpecies(input.milk.species));
  const saltKg = totalMassKg(input, 'salt');
  const { series, latest } = greenAndLatest(input);
  const greenKg = series.length ? series[0].kg : null;

  const coagulation = input.steps.find((s) => s.kind === 'coagulation');
  const cookTemps = input.steps
    .filter((s) => s.kind === 'cooking')
    .map(stepTemp)
    .filter((t): t is number => t !== null);

  const face = mouldFace(input.mould);
  const pressures =
    face && input.pressStages.length ? pressSchedulePressures(input.pressStages, face) : [];

  const ramp = checkHeatingRamp(cookReadings(input));

  return {
    saltGPerL: perLitre(saltKg, 'mass', milkL),
    saltPercent: saltKg !== null && greenKg ? saltPercentOfCurd(saltKg, greenKg) : null,
    colourMlPerL: perLitre(totalVolumeL(input, 'colouring'), 'volume', milkL),
    calciumChlorideMlPerL: perLitre(totalVolumeL(input, 'calcium-chloride'), 'volume', milkL),
    cultureGPerL: perLitre(totalMassKg(input, 'culture'), 'mass', milkL),
    coagulationTempC: coagulation ? stepTemp(coagulation) : null,
    cookTempC: cookTemps.length ? Math.max(...cookTemps) : null,
    cookRampCPer5Min: finiteOrNull(ramp.fastest?.ratePer5MinC),
    pressMaxKpa: pressures.length ? Math.max(...pressures.map((p) => p.kPa)) : null,
    yieldPercent: latest && milkKg > 0 ? yieldPercent(latest.kg, milkKg) : null,
    moistureLossPercent: latest && series.length > 1 ? latest.lossSinceGreenPercent : null,
  };
}

function predictedYield(input: JournalFiguresInput): { value: number; basis: string } | null {
  const { fatPercent, proteinPercent } = input.milk;
  if (fatPercent === null || proteinPercent === null) return null;
  let value: number;
  try {
    value = vanSlykeYield({
      fatPercent,
      proteinPercent,
      moisturePercent: PREDICTION_MOISTURE_PERCENT,
    });
  } catch {
    return null;
  }
  if (!(value > 0) || !Number.isFinite(value)) return null;
  const basis =
    `Van Slyke's cheddar formula (Van Slyke and Price, 1949) with ${formatNumber(fatPercent)} % fat and ` +
    `casein taken as ${Math.round(DEFAULT_CASEIN_FRACTION * 100)} % of the ${formatNumber(proteinPercent)} % ` +
    `protein, for a cheese of ${PREDICTION_MOISTURE_PERCENT} % moisture (a typical cheddar; ` +
    `the ${CHEDDAR_STANDARD.source} limit is ${CHEDDAR_STANDARD.maxMoisturePercent} %). ` +
    'For styles other than cheddar it is a rough guide only.';
  return { value, basis };
}

const RAW_MILK_GENERAL = `Made from unpasteurised milk. ${RAW_MILK_SALE_RULE} ${RAW_MILK_WHO_SHOULD_AVOID} ${RAW_MILK_LOCAL_RULES}`;

/** Returns every figure the journal page shows, worked out with shared/trade at an instant. */
export function journalDerivedFigures(
  input: JournalFiguresInput,
  at: Date | string | number = Date.now(),
): DerivedFiguresDto {
  const species = milkSpecies(input.milk.species);
  const density = milkDensity(species);
  const milkKg = milkMassKg(input.milk.volumeL, species);
  const metrics = journalMetrics(input);
  const { series, latest } = greenAndLatest(input);

  const prediction = predictedYield(input);
  const actual = metrics.yieldPercent;

  const face = mouldFace(input.mould);
  const press =
    face && input.pressStages.length ? pressSchedulePressures(input.pressStages, face) : [];

  const ramp = checkHeatingRamp(cookReadings(input));

  const targetDays = input.aging.targetDays;
  const unpasteurised =
    input.milk.heatTreatment === 'raw' || input.milk.heatTreatment === 'thermised';
  // Once cut, a wheel stops aging: the page shows its age at opening, not a running age.
  const cut = CUT_WHEEL_STATUSES.includes(input.aging.wheelStatus ?? '');
  const openedOn = cutOn({
    wheelStatus: input.aging.wheelStatus ?? '',
    openedOn: input.aging.openedOn ?? null,
  });
  const rawReady = rawMilkReadyCheck({
    heatTreatment: input.milk.heatTreatment,
    madeOn: input.makeDate,
    targetDays,
  });
  const caution = unpasteurised
    ? rawMilkCaution({ unpasteurised, madeOn: input.makeDate, at })
    : null;

  return {
    milkMassKg: milkKg,
    milkDensityAssumed: density.assumed,
    yield: {
      actualPercent: actual,
      kgPer100KgMilk: actual,
      predictedKgPer100Kg: prediction?.value ?? null,
      efficiency: actual !== null && prediction ? yieldEfficiency(actual, prediction.value) : null,
      basis: prediction?.basis ?? null,
    },
    moisture: {
      lossSinceGreenPercent: metrics.moistureLossPercent,
      ratePerWeekPercent:
        latest && series.length > 1 ? finiteOrNull(latest.averageRatePercentPerWeek) : null,
      series: series
        .filter((p) => !p.green)
        .map((p) => ({
          date: p.date,
          massKg: p.kg,
          lossSinceGreenPercent: p.lossSinceGreenPercent,
        })),
    },
    rates: {
      saltGramsPerLitre: metrics.saltGPerL,
      saltPercentOfCheese: metrics.saltPercent,
      colouringMlPerLitre: metrics.colourMlPerL,
      calciumChlorideMlPerLitre: metrics.calciumChlorideMlPerL,
      cultureGramsPerLitre: metrics.cultureGPerL,
    },
    press: press.map((p) => ({
      stage: p.stage,
      loadN: p.loadN,
      minutes: p.minutes,
      kPa: p.kPa,
      psi: p.psi,
      startMinute: p.startMinute,
      endMinute: p.endMinute,
    })),
    ramp: {
      limitCPer5Min: DEFAULT_RAMP_LIMIT_C_PER_5_MIN,
      fastestCPer5Min: metrics.cookRampCPer5Min,
      tooFast: ramp.exceeding.map((s) => ({
        fromAt: new Date(s.startMs).toISOString(),
        toAt: new Date(s.endMs).toISOString(),
        ratePer5MinC: s.maxRatePer5MinC,
      })),
    },
    aging: {
      ageDays: ageInDays(input.makeDate, at),
      targetDays,
      daysLeft: targetDays !== null ? daysToTarget(input.makeDate, targetDays, at) : null,
      readyDate: targetDays !== null ? readyDate(input.makeDate, targetDays) : null,
      cut,
      openedOn,
      ageAtOpeningDays: openedOn ? ageInDays(input.makeDate, openedOn) : null,
      rawMilkMinimumOn: rawReady?.minimumMetOn ?? null,
      readyBeforeRawMilkMinimum: rawReady?.readyBeforeMinimum ?? false,
    },
    rawMilkCaution: caution
      ? { flagged: caution.flagged, text: caution.flagged ? caution.message : RAW_MILK_GENERAL }
      : null,
  };
}

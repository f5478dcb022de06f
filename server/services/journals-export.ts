import { photoUrl } from '../../shared/constants/media';
import type { JournalExportTable } from '../../shared/schemas/journal';
import type { JournalDto } from '../../shared/types/journal';
import type { AppContext } from '../context';
import { toCsv, type CsvCell } from '../lib/csv';
import type { AuthMember } from '../middleware/authenticate';
import { presentJournal, type JournalAggregate } from '../presenters/journal.presenter';
import {
  listJournalChildren,
  listJournalsOfMember,
  type JournalRow,
} from '../repositories/journals.repository';

// Export of a member's own journals (data ownership): every journal of theirs, drafts and
// private ones included, with all child rows; photos as absolute URLs.

function groupBy<T extends { journalId: number }>(rows: T[]): Map<number, T[]> {
  const map = new Map<number, T[]>();
  for (const row of rows) {
    const list = map.get(row.journalId);
    if (list) list.push(row);
    else map.set(row.journalId, [row]);
  }
  return map;
}

async function loadOwnAggregates(ctx: AppContext, member: AuthMember) {
  const db = ctx.database.db;
  const heads = await listJournalsOfMember(db, member.id);
  const children = await listJournalChildren(
    db,
    heads.map((h) => h.journal.id),
  );
  const by = {
    ingredients: groupBy(children.ingredients),
    steps: groupBy(children.steps),
    pressStages: groupBy(children.pressStages),
    weighIns: groupBy(children.weighIns),
    readings: groupBy(children.readings),
    photos: groupBy(children.photos),
  };
  return heads.map((h): JournalAggregate => ({
    journal: h.journal,
    maker: h.maker,
    style: h.style,
    ingredients: by.ingredients.get(h.journal.id) ?? [],
    steps: by.steps.get(h.journal.id) ?? [],
    pressStages: by.pressStages.get(h.journal.id) ?? [],
    weighIns: by.weighIns.get(h.journal.id) ?? [],
    readings: by.readings.get(h.journal.id) ?? [],
    photos: by.photos.get(h.journal.id) ?? [],
    source: null,
  }));
}

const absolute = (ctx: AppContext, url: string) =>
  /^https?:/.test(url) ? url : `${ctx.config.publicUrl.replace(/\/$/, '')}${url}`;

function withAbsolutePhotoUrls<T extends Omit<JournalDto, 'version' | 'hidden'>>(
  ctx: AppContext,
  dto: T,
): T {
  const fix = (p: JournalDto['photos'][number]) => ({
    ...p,
    sources: p.sources.map((s) => ({ ...s, url: absolute(ctx, s.url) })),
  });
  return { ...dto, photos: dto.photos.map(fix), cover: dto.cover ? fix(dto.cover) : null };
}

/** The member's journals as one JSON document (the JournalDto of each, photos as URLs). */
export async function exportJson(ctx: AppContext, member: AuthMember): Promise<string> {
  const aggregates = await loadOwnAggregates(ctx, member);
  const now = new Date();
  const journals = aggregates.map((a) => {
    const dto = presentJournal(a, { canEdit: true, now });
    // The source may be another member's journal: its id only, its title is theirs to show.
    return { ...withAbsolutePhotoUrls(ctx, dto), sourceJournalId: a.journal.sourceJournalId };
  });
  return JSON.stringify(
    {
      format: 'rindwise-journals',
      version: 1,
      exportedAt: now.toISOString(),
      member: { handle: member.handle, displayName: member.displayName },
      units: 'SI: litres, kilograms, degrees Celsius, millimetres, newtons, minutes',
      journals,
    },
    null,
    2,
  );
}

const JOURNAL_COLUMNS: [string, (j: JournalRow, a: JournalAggregate) => CsvCell][] = [
  ['journal_id', (j) => j.id],
  ['title', (j) => j.title],
  ['style', (_j, a) => a.style.slug],
  ['make_date', (j) => j.makeDate],
  ['status', (j) => j.status],
  ['visibility', (j) => j.visibility],
  ['wheel_status', (j) => j.wheelStatus],
  ['milk_volume_l', (j) => j.milkVolumeL],
  ['milk_volume_unit', (j) => j.milkVolumeUnit],
  ['species', (j) => j.species],
  ['heat_treatment', (j) => j.heatTreatment],
  ['homogenised', (j) => j.homogenised],
  ['fat_percent', (j) => j.fatPercent],
  ['protein_percent', (j) => j.proteinPercent],
  ['mould_shape', (j) => j.mouldShape],
  ['mould_diameter_mm', (j) => j.mouldDiameterMm],
  ['mould_length_mm', (j) => j.mouldLengthMm],
  ['mould_width_mm', (j) => j.mouldWidthMm],
  ['rind_treatment', (j) => j.rindTreatment],
  ['drying_days', (j) => j.dryingDays],
  ['aging_target_days', (j) => j.agingTargetDays],
  ['aging_temp_c', (j) => j.agingTempC],
  ['aging_humidity_percent', (j) => j.agingHumidityPercent],
  ['aging_check_date', (j) => j.agingCheckDate],
  ['green_weight_kg', (j) => j.greenWeightKg],
  ['salt_g_per_l', (j) => j.metricSaltGPerL],
  ['salt_percent_of_cheese', (j) => j.metricSaltPercent],
  ['colouring_ml_per_l', (j) => j.metricColourMlPerL],
  ['calcium_chloride_ml_per_l', (j) => j.metricCalciumChlorideMlPerL],
  ['culture_g_per_l', (j) => j.metricCultureGPerL],
  ['coagulation_temp_c', (j) => j.metricCoagulationTempC],
  ['cook_temp_c', (j) => j.metricCookTempC],
  ['cook_ramp_c_per_5min', (j) => j.metricCookRampCPer5Min],
  ['press_max_kpa', (j) => j.metricPressMaxKpa],
  ['yield_percent', (j) => j.metricYieldPercent],
  ['moisture_loss_percent', (j) => j.metricMoistureLossPercent],
  ['tasting_count', (j) => j.tastingCount],
  ['mean_overall', (j) => j.meanOverall],
  ['ingredient_count', (_j, a) => a.ingredients.length],
  ['step_count', (_j, a) => a.steps.length],
  ['press_stage_count', (_j, a) => a.pressStages.length],
  ['weigh_in_count', (_j, a) => a.weighIns.length],
  ['reading_count', (_j, a) => a.readings.length],
  ['photo_count', (_j, a) => a.photos.length],
  ['source_journal_id', (j) => j.sourceJournalId],
  ['published_at', (j) => j.publishedAt],
  ['created_at', (j) => j.createdAt],
  ['updated_at', (j) => j.updatedAt],
  ['notes', (j) => j.notes],
];

function childTable(
  ctx: AppContext,
  table: Exclude<JournalExportTable, 'journals'>,
  aggregates: JournalAggregate[],
): { header: string[]; rows: CsvCell[][] } {
  const lead = (a: JournalAggregate): CsvCell[] => [a.journal.id, a.journal.title];
  switch (table) {
    case 'ingredients':
      return {
        header: [
          'journal_id',
          'journal_title',
          'position',
          'kind',
          'name',
          'amount',
          'unit',
          'ml_per_drop',
          'si_value',
          'si_unit',
          'note',
        ],
        rows: aggregates.flatMap((a) =>
          a.ingredients.map((i) => [
            ...lead(a),
            i.position + 1,
            i.kind,
            i.name,
            i.amount,
            i.unit,
            i.mlPerDrop,
            i.siValue,
            i.siDimension === 'volume' ? 'L' : i.siDimension === 'mass' ? 'kg' : 'drops',
            i.note,
          ]),
        ),
      };
    case 'steps':
      return {
        header: [
          'journal_id',
          'journal_title',
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
        rows: aggregates.flatMap((a) =>
          a.steps.map((s) => [
            ...lead(a),
            s.position + 1,
            s.kind,
            s.targetTempC,
            s.actualTempC,
            s.targetMinutes,
            s.actualMinutes,
            s.startedAt,
            s.cutSizeMm,
            s.note,
          ]),
        ),
      };
    case 'press-stages':
      return {
        header: ['journal_id', 'journal_title', 'stage', 'load_n', 'load_unit', 'minutes'],
        rows: aggregates.flatMap((a) =>
          a.pressStages.map((p) => [...lead(a), p.position + 1, p.loadN, p.loadUnit, p.minutes]),
        ),
      };
    case 'weigh-ins':
      return {
        header: ['journal_id', 'journal_title', 'date', 'mass_kg', 'note'],
        rows: aggregates.flatMap((a) =>
          a.weighIns.map((w) => [...lead(a), w.date, w.massKg, w.note]),
        ),
      };
    case 'readings':
      return {
        header: [
          'journal_id',
          'journal_title',
          'reading_id',
          'taken_at',
          'temp_c',
          'ph',
          'step',
          'note',
        ],
        rows: aggregates.flatMap((a) =>
          a.readings.map((r) => [
            ...lead(a),
            r.id,
            r.takenAt,
            r.tempC,
            r.ph,
            r.stepIndex === null ? null : r.stepIndex + 1,
            r.note,
          ]),
        ),
      };
    case 'photos':
      return {
        header: ['journal_id', 'journal_title', 'position', 'caption', 'width', 'height', 'url'],
        rows: aggregates.flatMap((a) =>
          a.photos.map((p) => {
            const widths = p.widths.split(',').map(Number).filter(Number.isFinite);
            const largest = Math.max(...widths);
            return [
              ...lead(a),
              p.position + 1,
              p.caption,
              p.width,
              p.height,
              Number.isFinite(largest) ? absolute(ctx, photoUrl(p.fileKey, largest)) : null,
            ];
          }),
        ),
      };
  }
}

/**
 * The member's journals as CSV (RFC 4180): one row per journal with its main fields and
 * derived figures, or one child table (ingredients, steps, ...) keyed by journal_id.
 */
export async function exportCsv(
  ctx: AppContext,
  member: AuthMember,
  table: JournalExportTable,
): Promise<string> {
  const aggregates = await loadOwnAggregates(ctx, member);
  if (table === 'journals') {
    return toCsv(
      JOURNAL_COLUMNS.map(([name]) => name),
      aggregates.map((a) => JOURNAL_COLUMNS.map(([, cell]) => cell(a.journal, a))),
    );
  }
  const { header, rows } = childTable(ctx, table, aggregates);
  return toCsv(header, rows);
}

import { createHash } from 'node:crypto';
import type { z } from 'zod';
import type {
  copyJournalSchema,
  JournalExportTable,
  JournalInput,
  JournalListQuery,
  readingInputSchema,
  weighInSchema,
} from '../../shared/schemas/journal';
import { isoDate, calendarDateOf } from '../../shared/trade/time';
import { openedOnAfter } from '../../shared/trade/aging';
import { journalMetrics, type JournalMetrics } from '../../shared/trade/journal-figures';
import { scaleAmounts } from '../../shared/trade/scaling';
import { amountToSi, toLitres } from '../../shared/trade/units';
import type {
  HiddenMarkDto,
  JournalDto,
  JournalSummaryDto,
  ReadingDto,
} from '../../shared/types/journal';
import type { AppContext } from '../context';
import {
  AppError,
  ConflictError,
  ForbiddenError,
  NotFoundError,
  UnauthorizedError,
  ValidationError,
} from '../lib/errors';
import { toBooleanQuery } from '../lib/fulltext';
import type { AuthMember } from '../middleware/authenticate';
import {
  figuresInputOf,
  presentJournal,
  presentJournalSummary,
  presentReading,
  type JournalAggregate,
} from '../presenters/journal.presenter';
import {
  deleteJournal,
  findJournalById,
  findJournalRef,
  findJournalWithRefs,
  findReadingsByIds,
  findStyleBySlug,
  findStyleIdsBySlugs,
  insertJournal,
  insertJournalChildren,
  insertReadingsOnce,
  insertWeighIn,
  listCoverPhotos,
  listJournalChildren,
  listJournals,
  lockJournal,
  replaceJournalChildren,
  updateJournal,
  type Db,
  type JournalChildren,
  type JournalListFilter,
  type JournalRow,
  type NewJournalRow,
} from '../repositories/journals.repository';
import { findUserByHandle } from '../repositories/users.repository';
import { hiddenMarks, recordAudit } from './audit.service';
import { exportCsv, exportJson } from './journals-export';
import { accessTo, isStaff, type Viewer } from './journal-access';
import { deletePhotoFilesForJournal } from './photos.service';
import { refreshTastingAges } from '../repositories/tastings.repository';

export type ReadingInput = z.infer<typeof readingInputSchema>;
export type WeighInInput = z.infer<typeof weighInSchema>;
export type CopyInput = z.infer<typeof copyJournalSchema>;

const notFound = () =>
  new NotFoundError('JOURNAL_NOT_FOUND', 'There is no journal with that id, or it is not shared.');

// The journal if the member owns it; 404 when they may not even see it, 403 when they may.
async function ownedJournal(db: Db, member: AuthMember, id: number): Promise<JournalRow> {
  const journal = await findJournalById(db, id);
  if (!journal) throw notFound();
  const access = accessTo(journal, member);
  if (access === 'none') throw notFound();
  if (access !== 'owner') {
    throw new ForbiddenError('NOT_YOUR_JOURNAL', 'Only the maker can change this journal.');
  }
  return journal;
}

// --- from the document to rows -----------------------------------------------------------

function childRows(input: JournalInput): JournalChildren {
  return {
    ingredients: input.ingredients.map((i) => {
      const si = amountToSi(i.amount, i.unit);
      return {
        kind: i.kind,
        name: i.name,
        amount: i.amount,
        unit: i.unit,
        mlPerDrop: i.mlPerDrop,
        siValue: si.value,
        siDimension: si.dimension,
        note: i.note,
      };
    }),
    steps: input.steps.map((s) => ({
      kind: s.kind,
      targetTempC: s.targetTempC,
      actualTempC: s.actualTempC,
      targetMinutes: s.targetMinutes,
      actualMinutes: s.actualMinutes,
      startedAt: s.startedAt ? new Date(s.startedAt) : null,
      cutSizeMm: s.cutSizeMm,
      note: s.note,
    })),
    pressStages: input.pressStages.map((p) => ({
      loadN: p.loadN,
      loadUnit: p.loadUnit,
      minutes: p.minutes,
    })),
    weighIns: input.weighIns.map((w) => ({ date: w.date, massKg: w.massKg, note: w.note })),
  };
}

function documentColumns(input: JournalInput, styleId: number) {
  return {
    styleId,
    title: input.title,
    makeDate: input.makeDate,
    status: input.status,
    visibility: input.visibility,
    wheelStatus: input.wheelStatus,
    milkVolumeL: input.milk.volumeL,
    milkVolumeUnit: input.milk.volumeUnit,
    species: input.milk.species,
    heatTreatment: input.milk.heatTreatment,
    homogenised: input.milk.homogenised,
    fatPercent: input.milk.fatPercent,
    proteinPercent: input.milk.proteinPercent,
    mouldShape: input.mould.shape,
    mouldDiameterMm: input.mould.diameterMm,
    mouldLengthMm: input.mould.lengthMm,
    mouldWidthMm: input.mould.widthMm,
    mouldUnit: input.mould.unit,
    rindTreatment: input.rindTreatment,
    dryingDays: input.dryingDays,
    agingTargetDays: input.aging.targetDays,
    agingTempC: input.aging.tempC,
    agingHumidityPercent: input.aging.humidityPercent,
    agingCheckDate: input.aging.checkDate,
    greenWeightKg: input.greenWeightKg,
    notes: input.notes,
  } satisfies Partial<NewJournalRow>;
}

function metricColumns(m: JournalMetrics) {
  return {
    metricSaltGPerL: m.saltGPerL,
    metricSaltPercent: m.saltPercent,
    metricColourMlPerL: m.colourMlPerL,
    metricCalciumChlorideMlPerL: m.calciumChlorideMlPerL,
    metricCultureGPerL: m.cultureGPerL,
    metricCoagulationTempC: m.coagulationTempC,
    metricCookTempC: m.cookTempC,
    metricCookRampCPer5Min: m.cookRampCPer5Min,
    metricPressMaxKpa: m.pressMaxKpa,
    metricYieldPercent: m.yieldPercent,
    metricMoistureLossPercent: m.moistureLossPercent,
  } satisfies Partial<NewJournalRow>;
}

/** The metric_* columns worked out with shared/trade from a document and its vat readings. */
export function metricsForDocument(
  input: JournalInput,
  readings: JournalAggregate['readings'] = [],
) {
  return metricColumns(
    journalMetrics({
      makeDate: input.makeDate,
      milk: input.milk,
      mould: input.mould,
      ingredients: input.ingredients,
      steps: input.steps,
      pressStages: input.pressStages,
      greenWeightKg: input.greenWeightKg,
      weighIns: input.weighIns,
      readings,
      aging: input.aging,
    }),
  );
}

// --- the document's version ---------------------------------------------------------------

// Every journal column a PUT writes from the document (documentColumns above).
const DOCUMENT_COLUMNS = [
  'styleId',
  'title',
  'makeDate',
  'status',
  'visibility',
  'wheelStatus',
  'milkVolumeL',
  'milkVolumeUnit',
  'species',
  'heatTreatment',
  'homogenised',
  'fatPercent',
  'proteinPercent',
  'mouldShape',
  'mouldDiameterMm',
  'mouldLengthMm',
  'mouldWidthMm',
  'mouldUnit',
  'rindTreatment',
  'dryingDays',
  'agingTargetDays',
  'agingTempC',
  'agingHumidityPercent',
  'agingCheckDate',
  'greenWeightKg',
  'notes',
] as const satisfies readonly (keyof JournalRow)[];

type DocumentParts = Pick<JournalAggregate, 'ingredients' | 'steps' | 'pressStages' | 'weighIns'>;

/**
 * The version of a journal's document: a digest of every column and child row a PUT
 * replaces, read as stored. Any write to them (the editor, the vat, a weigh-in from the
 * cave) changes it; readings, photos, tastings and moderation do not, since a PUT leaves
 * them alone. Clients send it back in If-Match so a stale document never overwrites a newer one.
 */
export function documentVersion(journal: JournalRow, parts: DocumentParts): string {
  const canonical = JSON.stringify([
    DOCUMENT_COLUMNS.map((key) => journal[key]),
    parts.ingredients.map((i) => [i.kind, i.name, i.amount, i.unit, i.mlPerDrop, i.note]),
    parts.steps.map((s) => [
      s.kind,
      s.targetTempC,
      s.actualTempC,
      s.targetMinutes,
      s.actualMinutes,
      s.startedAt?.toISOString() ?? null,
      s.cutSizeMm,
      s.note,
    ]),
    parts.pressStages.map((p) => [p.loadN, p.loadUnit, p.minutes]),
    parts.weighIns.map((w) => [w.date, w.massKg, w.note]),
  ]);
  return `d1-${createHash('sha256').update(canonical).digest('base64url').slice(0, 22)}`;
}

/** A PUT whose If-Match names an older version: 409 with the journal as it is now. */
export class JournalChangedError extends AppError {
  constructor(current: JournalDto) {
    super(
      409,
      'JOURNAL_CHANGED',
      'This journal was changed somewhere else (another tab or device) after you opened it, so your save was not applied and nothing was overwritten. Your changes are kept: compare them with the saved version, then save again.',
      undefined,
      { current },
    );
  }
}

async function styleIdFor(db: Db, slug: string): Promise<number> {
  const style = await findStyleBySlug(db, slug);
  if (!style) throw new ValidationError({ styleSlug: 'That style is not in our list.' });
  return style.id;
}

function refuseUnverifiedPublish(member: AuthMember, input: JournalInput): void {
  if (input.status === 'published' && !member.emailVerified) {
    throw new ForbiddenError(
      'EMAIL_NOT_VERIFIED',
      'Please confirm your e-mail address before you publish: we sent you a link. You can save the journal as a draft meanwhile.',
    );
  }
}

/**
 * Stores a new journal with its child rows and metrics in one transaction and resolves with
 * its id; no permission checks (the seed and the services below call it).
 */
export async function storeNewJournal(
  db: Db,
  ownerId: number,
  input: JournalInput,
  extra: Partial<Pick<NewJournalRow, 'sourceJournalId' | 'publishedAt' | 'createdAt'>> = {},
): Promise<number> {
  const styleId = await styleIdFor(db, input.styleSlug);
  const publishedAt = input.status === 'published' ? (extra.publishedAt ?? new Date()) : null;
  return db.transaction(async (tx) => {
    const id = await insertJournal(tx, {
      ...documentColumns(input, styleId),
      ...metricsForDocument(input),
      ...extra,
      userId: ownerId,
      publishedAt,
    });
    await insertJournalChildren(tx, id, childRows(input));
    return id;
  });
}

// --- reading ------------------------------------------------------------------------------

async function loadAggregate(db: Db, id: number, viewer: Viewer) {
  const head = await findJournalWithRefs(db, id);
  if (!head) return null;
  const access = accessTo(head.journal, viewer);
  if (access === 'none') return null;
  const children = await listJournalChildren(db, [id]);
  let source: JournalAggregate['source'] = null;
  if (head.journal.sourceJournalId !== null) {
    const ref = await findJournalRef(db, head.journal.sourceJournalId);
    // The "started from" link names the source only to someone who may read it.
    if (ref && accessTo(ref, viewer) !== 'none') {
      source = { id: ref.id, title: ref.title, maker: ref.maker };
    }
  }
  const aggregate: JournalAggregate = {
    journal: head.journal,
    maker: head.maker,
    style: head.style,
    ...children,
    photos:
      access === 'reader' ? children.photos.filter((p) => p.hiddenAt === null) : children.photos,
    source,
  };
  return { aggregate, access };
}

/**
 * One journal as the viewer may see it, with derived figures and its document version;
 * its maker and staff also get the moderator's hide mark. 404 when it is not theirs to see.
 */
export async function getJournal(ctx: AppContext, viewer: Viewer, id: number): Promise<JournalDto> {
  const db = ctx.database.db;
  const found = await loadAggregate(db, id, viewer);
  if (!found) throw notFound();
  const { aggregate, access } = found;
  const dto = presentJournal(aggregate, { canEdit: access === 'owner' });
  const seesMarks = access === 'owner' || access === 'staff';
  const hiddenPhotos = seesMarks ? aggregate.photos.filter((p) => p.hiddenAt !== null) : [];
  const marks =
    seesMarks && (aggregate.journal.hiddenAt || hiddenPhotos.length)
      ? await hiddenMarks(db, [
          ...(aggregate.journal.hiddenAt
            ? [{ type: 'journal' as const, id, hiddenAt: aggregate.journal.hiddenAt }]
            : []),
          ...hiddenPhotos.map((p) => ({ type: 'photo' as const, id: p.id, hiddenAt: p.hiddenAt! })),
        ])
      : new Map<string, HiddenMarkDto>();
  return {
    ...dto,
    photos: dto.photos.map((p) => ({ ...p, hidden: marks.get(`photo:${p.id}`) ?? null })),
    version: documentVersion(aggregate.journal, aggregate),
    hidden: marks.get(`journal:${id}`) ?? null,
  };
}

const emptyPage = (query: JournalListQuery) => ({
  items: [] as JournalSummaryDto[],
  total: 0,
  page: query.page,
  pageSize: query.pageSize,
});

/**
 * A page of journals for Discover (published, public, not hidden, for everyone including staff)
 * or, with mine, the viewer's own journals of every status.
 */
export async function listJournalsFor(ctx: AppContext, viewer: Viewer, query: JournalListQuery) {
  const db = ctx.database.db;
  if (query.mine && !viewer) throw new UnauthorizedError('Sign in to see your journals.');
  const filter: JournalListFilter = {
    listedOnly: !query.mine,
    ownerId: query.mine ? viewer?.id : undefined,
    species: query.species,
    heat: query.heat,
    rind: query.rind,
    agingBy: query.agingBy,
    agingMin: query.agingMin,
    agingMax: query.agingMax,
    minScore: query.minScore,
    sort: query.sort,
    page: query.page,
    pageSize: query.pageSize,
  };
  if (query.style?.length) {
    filter.styleIds = await findStyleIdsBySlugs(db, query.style);
    if (!filter.styleIds.length) return emptyPage(query);
  }
  if (query.maker) {
    // "@handle" as members write it in notes and titles is the same maker.
    const maker = await findUserByHandle(db, query.maker.replace(/^@/, ''));
    if (!maker) return emptyPage(query);
    filter.makerId = maker.id;
  }
  if (query.q) {
    const fullText = toBooleanQuery(query.q);
    if (!fullText) return emptyPage(query);
    filter.fullText = fullText;
  }
  const { rows, total } = await listJournals(db, filter);
  const covers = await listCoverPhotos(
    db,
    rows.map((r) => r.journal.id),
  );
  // Only My journals can list a hidden one (Discover lists nothing hidden): its maker sees why.
  const hidden = rows.flatMap((r) =>
    r.journal.hiddenAt
      ? [{ type: 'journal' as const, id: r.journal.id, hiddenAt: r.journal.hiddenAt }]
      : [],
  );
  const marks = hidden.length ? await hiddenMarks(db, hidden) : new Map<string, HiddenMarkDto>();
  const now = new Date();
  return {
    items: rows.map((r) => ({
      ...presentJournalSummary(r, covers.get(r.journal.id) ?? null, now),
      hidden: marks.get(`journal:${r.journal.id}`) ?? null,
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

// --- writing ------------------------------------------------------------------------------

/** Records a new journal for the member; publishing needs a confirmed e-mail. */
export async function createJournal(
  ctx: AppContext,
  member: AuthMember,
  input: JournalInput,
): Promise<JournalDto> {
  refuseUnverifiedPublish(member, input);
  const id = await storeNewJournal(ctx.database.db, member.id, input);
  ctx.logger.info(
    { event: 'journal-created', journalId: id, userId: member.id },
    'journal created',
  );
  return getJournal(ctx, member, id);
}

/**
 * Replaces the whole document of the member's journal (columns, ingredients, steps, press
 * stages, weigh-ins) in one transaction; vat readings and photos stay. The first publish
 * stamps published_at. `ifMatch` is the document version the client edited (or '*' to
 * overwrite knowingly): when the stored document has changed since, nothing is written and
 * a JournalChangedError carries the journal as it is now.
 */
export async function updateJournalDocument(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  input: JournalInput,
  ifMatch: string,
): Promise<JournalDto> {
  const db = ctx.database.db;
  await ownedJournal(db, member, id);
  refuseUnverifiedPublish(member, input);
  const styleId = await styleIdFor(db, input.styleSlug);
  const applied = await db.transaction(async (tx) => {
    // The lock makes the check and the write one step: a second save waits, then sees ours.
    await lockJournal(tx, id);
    const current = await findJournalById(tx, id);
    if (!current) throw notFound();
    const children = await listJournalChildren(tx, [id]);
    if (ifMatch !== '*' && documentVersion(current, children) !== ifMatch) return false;
    await updateJournal(tx, id, {
      ...documentColumns(input, styleId),
      // A wheel marked opened or finished in the editor stops aging today (shared/trade/aging).
      openedOn: openedOnAfter(current, input.wheelStatus, isoDate(calendarDateOf(new Date()))),
      ...metricsForDocument(input, children.readings),
      publishedAt: current.publishedAt ?? (input.status === 'published' ? new Date() : null),
    });
    await replaceJournalChildren(tx, id, childRows(input));
    // Each tasting stores the wheel's age on the day; a corrected make date moves them all
    // (and what Compare relates to age).
    if (current.makeDate !== input.makeDate) await refreshTastingAges(tx, id);
    return true;
  });
  const journal = await getJournal(ctx, member, id);
  if (!applied) {
    ctx.logger.info(
      { event: 'journal-save-conflict', journalId: id, userId: member.id },
      'journal save refused: changed since the client read it',
    );
    throw new JournalChangedError(journal);
  }
  return journal;
}

const clipReason = (text: string) => text.trim().slice(0, 1000);

/**
 * Deletes a journal: its maker, a moderator or an admin; child and photo rows cascade. A
 * delete by staff of someone else's journal goes into the audit log (with the reason given)
 * in the same transaction as the delete.
 */
export async function deleteJournalAs(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  reason = '',
): Promise<void> {
  const db = ctx.database.db;
  const found = await findJournalWithRefs(db, id);
  if (!found) throw notFound();
  const { journal, maker } = found;
  const access = accessTo(journal, member);
  if (access === 'none') throw notFound();
  if (access === 'reader') {
    throw new ForbiddenError('NOT_YOUR_JOURNAL', 'Only the maker or a moderator can delete this.');
  }
  const byStaff = access === 'staff' && isStaff(member);
  // Files first: the photo rows that name them cascade with the journal.
  await deletePhotoFilesForJournal(ctx, id);
  await db.transaction(async (tx) => {
    await deleteJournal(tx, id);
    if (byStaff) {
      await recordAudit(tx, member, {
        action: 'journal-deleted',
        targetType: 'journal',
        targetId: id,
        targetUser: { id: maker.id, handle: maker.handle },
        summary: `Journal “${journal.title}” by @${maker.handle}`,
        note: clipReason(reason),
      });
    }
  });
  ctx.logger.info(
    {
      event: 'journal-deleted',
      journalId: id,
      actorId: member.id,
      ownerId: journal.userId,
      byStaff,
    },
    'journal deleted',
  );
}

function copyTitle(title: string, sourceHandle: string, own: boolean): string {
  const suffix = own ? ' (again)' : ` (from @${sourceHandle})`;
  const room = 140 - suffix.length;
  const base = title.length > room ? `${title.slice(0, room - 1).trimEnd()}…` : title;
  return `${base}${suffix}`;
}

/**
 * Starts a new private draft for the member from a journal they can read: every ingredient
 * amount scaled to the new milk volume (units kept), the steps as a plan (what the source
 * maker did becomes the target), the press schedule, the aging plan; no weigh-ins, readings,
 * photos or tastings. The draft links back to its source.
 */
export async function copyJournal(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  input: CopyInput,
): Promise<JournalDto> {
  const db = ctx.database.db;
  const found = await loadAggregate(db, id, member);
  if (!found) throw notFound();
  const { journal: src, maker, style, ingredients, steps, pressStages } = found.aggregate;
  const toL = toLitres(input.milkVolume, input.unit);
  const scaled = scaleAmounts(ingredients, src.milkVolumeL, toL);
  const today = isoDate(calendarDateOf(new Date()));
  const doc: JournalInput = {
    title: copyTitle(src.title, maker.handle, src.userId === member.id),
    styleSlug: style.slug,
    makeDate: today,
    status: 'draft',
    visibility: 'private',
    wheelStatus: 'making',
    milk: {
      volumeL: toL,
      volumeUnit: input.unit,
      species: src.species,
      heatTreatment: src.heatTreatment,
      homogenised: src.homogenised,
      fatPercent: src.fatPercent,
      proteinPercent: src.proteinPercent,
    },
    mould: {
      shape: src.mouldShape,
      diameterMm: src.mouldDiameterMm,
      lengthMm: src.mouldLengthMm,
      widthMm: src.mouldWidthMm,
      unit: src.mouldUnit,
    },
    rindTreatment: src.rindTreatment,
    dryingDays: src.dryingDays,
    aging: {
      targetDays: src.agingTargetDays,
      tempC: src.agingTempC,
      humidityPercent: src.agingHumidityPercent,
      checkDate: null,
    },
    greenWeightKg: null,
    notes: '',
    ingredients: scaled.map((i) => ({
      kind: i.kind,
      name: i.name,
      amount: i.amount,
      unit: i.unit,
      mlPerDrop: i.mlPerDrop,
      note: i.note,
    })),
    steps: steps.map((s) => ({
      kind: s.kind,
      targetTempC: s.targetTempC ?? s.actualTempC,
      actualTempC: null,
      targetMinutes: s.targetMinutes ?? s.actualMinutes,
      actualMinutes: null,
      startedAt: null,
      cutSizeMm: s.cutSizeMm,
      note: s.note,
    })),
    pressStages: pressStages.map((p) => ({
      loadN: p.loadN,
      loadUnit: p.loadUnit,
      minutes: p.minutes,
    })),
    weighIns: [],
  };
  const newId = await storeNewJournal(db, member.id, doc, { sourceJournalId: src.id });
  ctx.logger.info(
    { event: 'journal-copied', journalId: newId, sourceId: src.id, userId: member.id },
    'journal started from another',
  );
  return getJournal(ctx, member, newId);
}

// Re-derives every metric_* column from what is stored (after a reading or a weigh-in).
async function refreshMetrics(db: Db, id: number): Promise<void> {
  const journal = await findJournalById(db, id);
  if (!journal) return;
  const children = await listJournalChildren(db, [journal.id]);
  const metrics = journalMetrics(figuresInputOf(journal, children));
  await updateJournal(db, journal.id, metricColumns(metrics));
}

/**
 * Stores vat readings on the member's journal, each once by its client id (a replay from the
 * offline queue changes nothing), then re-derives the cook ramp. Resolves with the stored
 * readings in the order sent and how many were new.
 */
export async function addReadings(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  readings: ReadingInput[],
): Promise<{ readings: ReadingDto[]; created: number }> {
  const db = ctx.database.db;
  await ownedJournal(db, member, id);
  const ids = [...new Set(readings.map((r) => r.id.toLowerCase()))];
  const created = await db.transaction(async (tx) => {
    await lockJournal(tx, id);
    const before = await findReadingsByIds(tx, ids);
    if (before.some((r) => r.journalId !== id)) {
      throw new ConflictError(
        'READING_ID_TAKEN',
        'A reading with that id belongs to another journal. Make a new id for it.',
      );
    }
    const known = new Set(before.map((r) => r.id));
    const fresh = new Map<string, ReadingInput>();
    for (const r of readings) {
      const key = r.id.toLowerCase();
      if (!known.has(key) && !fresh.has(key)) fresh.set(key, r);
    }
    await insertReadingsOnce(
      tx,
      [...fresh].map(([key, r]) => ({
        id: key,
        journalId: id,
        takenAt: new Date(r.takenAt),
        tempC: r.tempC,
        ph: r.ph,
        stepIndex: r.stepIndex,
        note: r.note,
      })),
    );
    if (fresh.size) await refreshMetrics(tx, id);
    return fresh.size;
  });
  const stored = new Map((await findReadingsByIds(db, ids)).map((r) => [r.id, r]));
  return {
    readings: ids.flatMap((key) => {
      const row = stored.get(key);
      return row && row.journalId === id ? [presentReading(row)] : [];
    }),
    created,
  };
}

/** Appends a weigh-in to the member's journal and re-derives yield and moisture loss. */
export async function addWeighIn(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  weighIn: WeighInInput,
): Promise<JournalDto> {
  const db = ctx.database.db;
  await ownedJournal(db, member, id);
  await db.transaction(async (tx) => {
    await lockJournal(tx, id);
    await insertWeighIn(tx, {
      journalId: id,
      date: weighIn.date,
      massKg: weighIn.massKg,
      note: weighIn.note,
    });
    await refreshMetrics(tx, id);
  });
  return getJournal(ctx, member, id);
}

// --- export -------------------------------------------------------------------------------

/** The member's own journals with everything in them, as a JSON or CSV file. */
export async function exportJournals(
  ctx: AppContext,
  member: AuthMember,
  format: 'csv' | 'json',
  table: JournalExportTable,
): Promise<{ filename: string; contentType: string; body: string }> {
  const day = isoDate(calendarDateOf(new Date()));
  if (format === 'json') {
    return {
      filename: `rindwise-journals-${day}.json`,
      contentType: 'application/json; charset=utf-8',
      body: await exportJson(ctx, member),
    };
  }
  const suffix = table === 'journals' ? '' : `-${table}`;
  return {
    filename: `rindwise-journals${suffix}-${day}.csv`,
    contentType: 'text/csv; charset=utf-8; header=present',
    body: await exportCsv(ctx, member, table),
  };
}

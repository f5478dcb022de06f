import type { Defect, FlavourDescriptor } from '../../shared/constants/tasting';
import type { TastingDto } from '../../shared/types/tasting';
import { renderNotes } from '../lib/markdown';
import type { AuthMember } from '../middleware/authenticate';
import { isStaff } from '../services/journal-access';
import type { TastingRow } from '../repositories/tastings.repository';

/** Turns a tasting row and its taster into the DTO; notes rendered and sanitised. */
export function presentTasting(
  row: TastingRow,
  taster: { id: number; handle: string; displayName: string },
  viewer?: AuthMember,
): TastingDto {
  return {
    id: row.id,
    journalId: row.journalId,
    taster,
    tastedOn: row.tastedOn,
    ageDays: row.ageDays,
    overall: row.overall,
    appearance: row.appearance,
    aroma: row.aroma,
    flavour: row.flavour,
    texture: row.texture,
    finish: row.finish,
    descriptors: row.descriptors as FlavourDescriptor[],
    defects: row.defects as Defect[],
    notes: row.notes,
    notesHtml: renderNotes(row.notes),
    canEdit: viewer !== undefined && (viewer.id === row.tasterId || isStaff(viewer)),
    createdAt: row.createdAt.toISOString(),
  };
}

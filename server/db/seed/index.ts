import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { hashPassword } from '../../lib/passwords';
import type { AuthMember } from '../../middleware/authenticate';
import { insertTasting, refreshJournalTastingStats } from '../../repositories/tastings.repository';
import { addPhotos } from '../../services/photos.service';
import { addReadings, storeNewJournal } from '../../services/journals.service';
import { FLAVOUR_DESCRIPTORS, DEFECTS, typicalTraitsOf } from '../../../shared/constants/tasting';
import { journals, users } from '../schema';
import { DEMO_MEMBERS } from './club';
import { demoJournals, prng } from './journals';
import { demoPhoto } from './photos';

export type SeededAccount = { email: string; password: string; role: string; handle: string };

const TASTING_NOTES = [
  'Opened at the club evening. Clean, firm, a little sharp at the finish.',
  'Good knit, no openings. Wanted more salt.',
  'Sweet and nutty; the rind kept it well.',
  'A bit bitter near the rind; the middle was lovely.',
  'Crumbly but pleasant. Would press harder next time.',
  'Buttery, mild. Everyone asked for a second piece.',
];

/**
 * Seeds the invented demo club: members, their journals with drawn photos, vat readings for
 * the cheddars, and tastings of the opened wheels by several members. Refuses to run when
 * members already exist, so a real install is never touched.
 */
export async function seedDemo(ctx: AppContext): Promise<SeededAccount[]> {
  const db = ctx.database.db;
  const existing = await db.select({ id: users.id }).from(users).limit(1);
  if (existing.length) {
    ctx.logger.warn('members already exist: the demo seed only runs on an empty database');
    return [];
  }
  const now = Date.now();
  const members = new Map<string, AuthMember>();
  for (const m of DEMO_MEMBERS) {
    const createdAt = new Date(now - 330 * 86_400_000);
    const [row] = await db
      .insert(users)
      .values({
        email: m.email,
        handle: m.handle,
        displayName: m.displayName,
        passwordHash: await hashPassword(m.password),
        role: m.role,
        units: m.units,
        bio: m.bio,
        emailVerifiedAt: createdAt,
        createdAt,
      })
      .$returningId();
    const [user] = await db.select().from(users).where(eq(users.id, row.id));
    members.set(m.handle, {
      id: user.id,
      email: user.email,
      handle: user.handle,
      displayName: user.displayName,
      role: user.role,
      units: user.units,
      remindersEnabled: user.remindersEnabled,
      notifyComments: user.notifyComments,
      bio: user.bio ?? '',
      emailVerified: true,
      createdAt: user.createdAt,
    });
  }

  const r = prng(4242);
  const scratch = mkdtempSync(path.join(os.tmpdir(), 'rindwise-seed-'));
  try {
    let index = 0;
    for (const { makerHandle, doc, ageDays } of demoJournals(new Date(now))) {
      index += 1;
      const maker = members.get(makerHandle)!;
      const makeTime = Date.parse(`${doc.makeDate}T07:00:00Z`);
      const id = await storeNewJournal(db, maker.id, doc, {
        createdAt: new Date(makeTime),
        publishedAt: doc.status === 'published' ? new Date(makeTime + 86_400_000) : undefined,
      });

      // Photos: one or two drawn wheels per journal, through the real upload pipeline.
      const count = index % 3 === 0 ? 2 : 1;
      const files = [];
      for (let p = 0; p < count; p++) {
        const file = path.join(scratch, `wheel-${index}-${p}.jpg`);
        writeFileSync(file, await demoPhoto(doc.styleSlug, index * 10 + p, 1920, 1440));
        files.push({ path: file, name: `wheel-${index}-${p}.jpg`, size: 0 });
      }
      await addPhotos(ctx, maker, id, {
        files,
        fields: {
          captions: files.map((_, p) =>
            p === 0 ? 'The wheel after drying' : 'Cut face at the first tasting',
          ),
        },
      });

      // Vat readings during the cook for the cheddars: a steady climb, one make a little fast.
      const cook = doc.steps.findIndex((s) => s.kind === 'cooking');
      if (cook >= 0 && doc.steps[cook].startedAt && doc.styleSlug.includes('cheddar')) {
        const start = Date.parse(doc.steps[cook].startedAt!);
        const from = doc.steps[cook - 1]?.targetTempC ?? 31;
        const to = doc.steps[cook].targetTempC ?? 38;
        const minutes = index % 4 === 0 ? 20 : 40;
        const readings = Array.from({ length: 6 }, (_, k) => ({
          id: randomUUID(),
          takenAt: new Date(start + (k * minutes * 60_000) / 5).toISOString(),
          tempC: Math.round((from + ((to - from) * k) / 5) * 10) / 10,
          ph: k === 5 ? 6.3 : null,
          stepIndex: cook,
          note: '',
        }));
        await addReadings(ctx, maker, id, readings);
      }

      // Tastings of opened wheels, by the maker and friends from the club.
      if (doc.wheelStatus === 'opened' && doc.status === 'published') {
        const salt = doc.ingredients.find((i) => i.kind === 'salt');
        const saltPerL = salt ? salt.amount / doc.milk.volumeL : 2;
        const tasters = [
          maker,
          ...[...members.values()]
            .filter((m) => m.id !== maker.id)
            .sort(() => r() - 0.5)
            .slice(0, 1 + Math.floor(r() * 3)),
        ];
        const firstAge = (doc.aging.targetDays ?? 60) + Math.round(r() * 10);
        for (const [k, taster] of tasters.entries()) {
          const age = Math.min(
            ageDays,
            firstAge + (k === tasters.length - 1 && tasters.length > 2 ? 30 : 0),
          );
          const tastedOn = new Date(makeTime + age * 86_400_000).toISOString().slice(0, 10);
          // A planted, noisy relation for Compare: saltier cheese scored a little higher.
          const base = 4.2 + 0.9 * (saltPerL - 1.5) + (r() - 0.5) * 2.2;
          const score = (shift: number) =>
            Math.max(1, Math.min(9, Math.round(base + shift + (r() - 0.5) * 1.6)));
          await insertTasting(db, {
            journalId: id,
            tasterId: taster.id,
            tastedOn,
            ageDays: age,
            overall: score(0),
            appearance: score(0.4),
            aroma: score(0),
            flavour: score(0.1),
            texture: score(-0.3),
            finish: score(-0.2),
            descriptors: FLAVOUR_DESCRIPTORS.filter(() => r() < 0.18).map((d) => d.key),
            defects: DEFECTS.filter(() => r() < 0.06)
              .map((d) => d.key)
              .filter((d) => !typicalTraitsOf(doc.styleSlug).has(d)),
            notes: TASTING_NOTES[Math.floor(r() * TASTING_NOTES.length)],
          });
        }
        // The maker's first tasting is the day the wheel was opened (its age stops there).
        const openedOn = new Date(makeTime + Math.min(ageDays, firstAge) * 86_400_000)
          .toISOString()
          .slice(0, 10);
        await db.update(journals).set({ openedOn }).where(eq(journals.id, id));
        await refreshJournalTastingStats(db, id);
      }
    }
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
  return DEMO_MEMBERS.map(({ email, password, role, handle }) => ({
    email,
    password,
    role,
    handle,
  }));
}

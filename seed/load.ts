import { parseGrit, type GritStandard } from '@shared/grit';
import type { Database } from '../server/db/database';
import { Abrasive, Method, PageRevision, Result, ResultEvent, Steel, User } from '../server/models';
import { resultRow } from '../server/commands/submit-result';
import { members } from './data/members';
import { steels } from './data/steels';
import { abrasives } from './data/abrasives';
import { methods } from './data/methods';
import { generateResults } from './data/results';
import { DEMO_NOTICE } from './data/notice';

const DAY_MS = 24 * 3600 * 1000;

/**
 * Loads the invented demo community into an empty database, in one transaction: members,
 * reference pages with a first revision each, results with their review trail; the comparison
 * cells follow from the change feed in the same transaction. Does nothing when any account exists. Returns what it inserted.
 */
export async function loadDemoData(db: Database, now = new Date()): Promise<{ loaded: boolean; results: number }> {
  if ((await User.count()) > 0) return { loaded: false, results: 0 };
  const count = await db.write(async (transaction) => {
    const users = await User.bulkCreate(
      members.map((m) => ({ handle: m.handle, displayName: m.displayName, email: m.email, role: m.role, oauthSubject: m.handle, bio: m.bio })),
      { transaction },
    );
    const userByHandle = new Map(users.map((u) => [u.handle, u]));
    const admin = users.find((u) => u.role === 'admin')!;
    const moderators = users.filter((u) => u.role === 'moderator');
    const summary = `First version, from the demo data. ${DEMO_NOTICE}`;

    const addRevision = async (pageType: 'steel' | 'abrasive' | 'method', page: Steel | Abrasive | Method, fields: Record<string, unknown>) => {
      const revision = await PageRevision.create(
        { pageType, pageId: page.id, authorId: admin.id, summary, fields, body: page.body, status: 'live' },
        { transaction },
      );
      page.currentRevisionId = revision.id;
      await page.save({ transaction });
    };

    const steelBySlug = new Map<string, Steel>();
    for (const s of steels) {
      const { body, ...fields } = s;
      const steel = await Steel.create(
        { slug: s.slug, name: s.name, category: s.category, designations: s.designations, composition: s.composition, hardnessMinHrc: s.hardnessHrc.min, hardnessMaxHrc: s.hardnessHrc.max, body, citations: s.citations },
        { transaction },
      );
      await addRevision('steel', steel, fields);
      steelBySlug.set(s.slug, steel);
    }

    const abrasiveBySlug = new Map<string, Abrasive>();
    for (const a of abrasives) {
      const { body, ...fields } = a;
      const parsed = parseGrit(a.grit.grade, a.grit.standard as GritStandard);
      const abrasive = await Abrasive.create(
        {
          slug: a.slug, name: a.name, material: a.material, bond: a.bond, form: a.form,
          gritStandard: parsed.standard, gritGrade: parsed.grade, gritUm: parsed.micrometres, gritRange: a.gritRange ?? null,
          wheelDiameterMm: a.wheelDiameterMm, widthMm: a.widthMm, wears: a.wears, coolant: a.coolant, sideUsable: a.sideUsable, body,
        },
        { transaction },
      );
      await addRevision('abrasive', abrasive, fields);
      abrasiveBySlug.set(a.slug, abrasive);
    }

    const methodBySlug = new Map<string, Method>();
    const ordered = [...methods].sort((a, b) => a.version - b.version);
    for (const m of ordered) {
      const { body, replacesSlug, ...fields } = m;
      const method = await Method.create(
        {
          slug: m.slug, name: m.name, version: m.version, replacesId: replacesSlug ? (methodBySlug.get(replacesSlug)?.id ?? null) : null,
          instrument: m.instrument, medium: m.medium, readingsPerEdge: m.readingsPerEdge, retentionMedium: m.retentionMedium, thresholdG: m.thresholdG, body,
        },
        { transaction },
      );
      await addRevision('method', method, { ...fields, replacesSlug });
      methodBySlug.set(m.slug, method);
    }

    const seeded = generateResults();
    const rows = seeded.map((r, i) => {
      const author = userByHandle.get(r.author)!;
      const createdAt = new Date(now.getTime() - r.daysAgo * DAY_MS - i * 1000);
      const row = resultRow(author.id, r.status, r.input, {
        steel: steelBySlug.get(r.input.steel)!,
        abrasive: abrasiveBySlug.get(r.input.abrasive)!,
        sharpnessMethod: methodBySlug.get(r.input.sharpness.method)!,
        retentionMethod: r.input.retention ? methodBySlug.get(r.input.retention.method)! : null,
        stepAbrasives: new Map((r.input.progression ?? []).map((s) => [s.abrasive, abrasiveBySlug.get(s.abrasive)!])),
      });
      const decidedAt = new Date(createdAt.getTime() + DAY_MS / 2);
      return { ...row, approvedAt: r.status === 'approved' ? decidedAt : null, createdAt, updatedAt: r.status === 'pending' ? createdAt : decidedAt };
    });
    const inserted = await Result.bulkCreate(rows, { transaction });
    const events = inserted.flatMap((result, i) => {
      const r = seeded[i];
      const first = { resultId: result.id, actorId: result.authorId, fromStatus: null, toStatus: 'pending' as const, note: null, createdAt: result.createdAt };
      if (r.status === 'pending') return [first];
      const reviewer = moderators.find((m) => m.id !== result.authorId) ?? admin;
      return [first, { resultId: result.id, actorId: reviewer.id, fromStatus: 'pending' as const, toStatus: r.status, note: r.reviewNote ?? null, createdAt: result.updatedAt }];
    });
    await ResultEvent.bulkCreate(events, { transaction });
    return inserted.length;
  });
  return { loaded: true, results: count };
}

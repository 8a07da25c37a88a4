import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { User } from '../../../shared/schemas/auth';
import { caseCreateSchema, casePatchSchema } from '../../../shared/schemas/case';
import { hashPassword } from '../../auth/password';
import { backdateCase, backdatePin, backdateSince, caseTimes, historyMarks } from '../../db/repositories/backdating';
import { findUserByEmail, insertUser } from '../../db/repositories/users';
import type { AppDeps } from '../../deps';
import type { MailQueue } from '../../mail/mail-queue';
import { addAttachment } from '../../services/attachments';
import { createCase, submitCase, updateCase } from '../../services/cases';
import { markDiagnosesCurrent } from '../../services/rediagnose';
import { addComment } from '../../services/comments';
import { pinLesson } from '../../services/lessons';
import { reviewCase } from '../../services/review';
import { toUser } from '../../services/users';
import { storagePaths } from '../../storage';
import { AC_COUPLING_CASES } from './cases-ac-coupling';
import { ALIASING_CASES } from './cases-aliasing';
import { ATTENUATION_CASES } from './cases-attenuation';
import { BANDWIDTH_CASES } from './cases-bandwidth';
import { CLIPPING_CASES } from './cases-clipping';
import { COMMON_MODE_CASES } from './cases-common-mode';
import { COMPENSATION_CASES } from './cases-compensation';
import { GENERATOR_LOAD_CASES } from './cases-generator-load';
import { GROUND_LEAD_CASES } from './cases-ground-lead';
import { LOADING_CASES } from './cases-loading';
import { MAINS_PICKUP_CASES } from './cases-mains-pickup';
import { OTHER_CASES } from './cases-other';
import { TERMINATION_CASES } from './cases-termination';
import { DEMO_PEOPLE } from './people';
import { renderTracePng } from './plot-png';
import { readDemoCapture } from './capture-files';
import type { DemoCase, DemoStep } from './types';

/** Every demo case, oldest first, so ids follow the story and originals exist before duplicates. */
export const DEMO_CASES: DemoCase[] = [
  ...ATTENUATION_CASES,
  ...TERMINATION_CASES,
  ...LOADING_CASES,
  ...BANDWIDTH_CASES,
  ...COMPENSATION_CASES,
  ...GROUND_LEAD_CASES,
  ...ALIASING_CASES,
  ...CLIPPING_CASES,
  ...AC_COUPLING_CASES,
  ...COMMON_MODE_CASES,
  ...MAINS_PICKUP_CASES,
  ...GENERATOR_LOAD_CASES,
  ...OTHER_CASES,
].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.key.localeCompare(b.key));

/** Replaying the story must not mail ten people about events dated months ago. */
const silentMail: MailQueue = {
  send: async () => {},
  enqueue: async () => {},
  wake: () => {},
  retryDue: async () => 0,
  start: () => {},
  stop: () => {},
};

export interface DemoSeedResult {
  people: number;
  cases: number;
  attachments: number;
  /** Case id by the scenario's key, for tests and for people reading the log. */
  ids: Map<string, number>;
}

const minutesAfter = (iso: string, minutes: number) => new Date(Date.parse(iso) + minutes * 60_000).toISOString();

async function seedPeople(deps: AppDeps, password: string): Promise<Map<string, User>> {
  // one hash for everyone: scrypt costs ~100 ms and start-up must stay quick
  const passwordHash = await hashPassword(password);
  const people = new Map<string, User>();
  for (const p of DEMO_PEOPLE) {
    const row =
      (await findUserByEmail(deps.db, p.email)) ??
      (await insertUser(deps.db, { email: p.email, name: p.name, role: p.role, password_hash: passwordHash, created_at: p.joinedAt, updated_at: p.joinedAt }));
    people.set(p.handle, toUser(row));
  }
  return people;
}

async function attachFiles(deps: AppDeps, author: User, caseId: number, c: DemoCase): Promise<number> {
  if (!c.attach?.length) return 0;
  // made by `npm run demo:captures` from the case's ngspice netlist, never by the engine
  const { bytes: csv, trace } = readDemoCapture(c.key);
  const { incomingDir } = storagePaths(deps.config);
  let minutes = 5;
  for (const kind of c.attach) {
    const [bytes, name] = kind === 'capture' ? [csv, `${c.key}-capture.csv`] : [await renderTracePng(trace), `${c.key}-screen.png`];
    const file = path.join(incomingDir, `demo-${c.key}-${kind}`);
    await writeFile(file, bytes);
    const marks = await historyMarks(deps.db);
    const before = await caseTimes(deps.db, caseId);
    await addAttachment(deps, author, caseId, { path: file, originalName: name, sizeBytes: bytes.length });
    const at = minutesAfter(c.createdAt, minutes);
    await backdateSince(deps.db, marks, at);
    await backdateCase(deps.db, caseId, before, at);
    minutes += 3;
  }
  return c.attach.length;
}

async function runStep(deps: AppDeps, people: Map<string, User>, ids: Map<string, number>, c: DemoCase, caseId: number, step: DemoStep) {
  const author = people.get(c.author)!;
  const by = (handle: string) => {
    const user = people.get(handle);
    if (!user) throw new Error(`demo case ${c.key}: no person "${handle}"`);
    return user;
  };
  switch (step.do) {
    case 'comment':
      return addComment(deps, by(step.by), caseId, step.body);
    case 'submit':
      return submitCase(deps, author, caseId);
    case 'revise':
      return updateCase(deps, step.by ? by(step.by) : author, caseId, casePatchSchema.parse(step.patch));
    case 'send_back':
      return reviewCase(deps, by(step.by), caseId, { action: 'send_back', note: step.note });
    case 'verify':
      return reviewCase(deps, by(step.by), caseId, { action: 'verify', note: step.note });
    case 'retire':
      return reviewCase(deps, by(step.by), caseId, { action: 'retire', note: step.note });
    case 'duplicate': {
      const original = ids.get(step.of);
      if (!original) throw new Error(`demo case ${c.key}: duplicate of unknown or later case "${step.of}"`);
      return reviewCase(deps, by(step.by), caseId, { action: 'duplicate', duplicateOf: original, note: step.note });
    }
    case 'pin':
      await pinLesson(deps, by(step.by), caseId, true);
      return backdatePin(deps.db, caseId, step.at);
  }
}

/** The narrative's own "**Safety:**" paragraph, which the authors wrote before the Safety note field existed. */
function safetyParagraph(narrative: string | undefined): string | undefined {
  const match = /^\*\*Safety:\*\*\s*(.+)$/m.exec(narrative ?? '');
  return match ? match[1].trim().slice(0, 2000) : undefined;
}

/**
 * Fills an empty casebook with the invented Quillfen Instruments team: its people (the three
 * demo accounts among them, all with `password`), and every case of the scenario written,
 * attached, commented, reviewed and pinned through the same services the API uses, each action
 * dated as the story says. Deterministic: the same data on every run.
 */
export async function seedDemoCasebook(deps: AppDeps, password: string): Promise<DemoSeedResult> {
  const quiet: AppDeps = { ...deps, mail: silentMail };
  const people = await seedPeople(quiet, password);
  const ids = new Map<string, number>();
  let attachments = 0;
  for (const c of DEMO_CASES) {
    const author = people.get(c.author);
    if (!author) throw new Error(`demo case ${c.key}: no author "${c.author}"`);
    const marks = await historyMarks(deps.db);
    // through the same schema as the API, so the demo holds only what a user could have saved
    const created = await createCase(quiet, author, caseCreateSchema.parse({
      title: c.title,
      summary: c.summary,
      narrative: c.narrative,
      setup: c.setup,
      statedCause: c.statedCause,
      statedCauseOther: c.statedCauseOther,
      fix: c.fix,
      lessonSummary: c.lessonSummary,
      lessonDetail: c.lessonDetail,
      safetyNote: c.safetyNote ?? safetyParagraph(c.narrative),
      tags: c.tags,
    }));
    await backdateSince(deps.db, marks, c.createdAt);
    await backdateCase(deps.db, created.id, null, c.createdAt);
    ids.set(c.key, created.id);
    attachments += await attachFiles(quiet, author, created.id, c);
    for (const step of c.steps) {
      const stepMarks = await historyMarks(deps.db);
      const before = await caseTimes(deps.db, created.id);
      await runStep(quiet, people, ids, c, created.id, step);
      await backdateSince(deps.db, stepMarks, step.at);
      await backdateCase(deps.db, created.id, before, step.at);
    }
  }
  // every diagnosis was just computed by this engine: no re-diagnosis at the next start
  await markDiagnosesCurrent(deps.db);
  return { people: people.size, cases: DEMO_CASES.length, attachments, ids };
}

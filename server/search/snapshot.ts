import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { CaseFacts } from './case-document';
import { CaseIndex, type IndexTuning } from './case-index';
import { CompactEngine, type CompactHeader } from './compact-engine';

/** Bump when the analysis or the document layout changes: older snapshots are then rebuilt. */
/** 4: field lengths count index terms, not distinct terms (BM25F). 5: irregular forms also indexed as written. */
export const SNAPSHOT_VERSION = 5;

interface SnapshotHeader {
  version: number;
  /** The index's own fingerprint of what it holds (see `indexStamp`). */
  stamp: string;
  engine: CompactHeader;
  facts: [number, CaseFacts][];
}

export const snapshotPath = (dataDir: string) => path.join(dataDir, 'search', 'case-index.snapshot');

/**
 * The same fingerprint `searchSourceStamp` computes from the database, computed from what the
 * index holds. Written with the snapshot: a database that changed behind the index's back (a
 * write that did not sync, a tag renamed) then no longer matches, and the index is rebuilt.
 */
export function indexStamp(index: CaseIndex, synonyms: { count: number; length: number }): string {
  let latest = '';
  let ids = 0;
  let tags = 0;
  let tagLength = 0;
  for (const [id, f] of index.facts) {
    if (f.updatedAt > latest) latest = f.updatedAt;
    ids += id;
    tags += f.tags.length;
    for (const t of f.tags) tagLength += t.length;
  }
  return [index.facts.size, latest, ids, tags, tagLength, synonyms.count, synonyms.length].join('|');
}

/** One file: a 4-byte length, the JSON header padded to 4 bytes, then the arrays. Written aside, then renamed into place. */
export function writeSnapshot(dataDir: string, index: CaseIndex, stamp: string) {
  const { header, body } = index.engine.encode();
  let json = Buffer.from(JSON.stringify({ version: SNAPSHOT_VERSION, stamp, engine: header, facts: [...index.facts] } satisfies SnapshotHeader));
  if (json.length % 4) json = Buffer.concat([json, Buffer.alloc(4 - (json.length % 4), 0x20)]);
  const length = Buffer.alloc(4);
  length.writeUInt32LE(json.length);
  const file = snapshotPath(dataDir);
  mkdirSync(path.dirname(file), { recursive: true });
  writeFileSync(`${file}.tmp`, Buffer.concat([length, json, body]));
  renameSync(`${file}.tmp`, file);
}

/** The snapshot's index when it exists, is readable, and matches `stamp`; otherwise undefined. */
export function readSnapshot(dataDir: string, stamp: string, _tuning?: IndexTuning): CaseIndex | undefined {
  const file = snapshotPath(dataDir);
  if (!existsSync(file)) return undefined;
  try {
    const bytes = readFileSync(file);
    const length = bytes.readUInt32LE(0);
    const header = JSON.parse(bytes.subarray(4, 4 + length).toString('utf8')) as SnapshotHeader;
    if (header.version !== SNAPSHOT_VERSION || header.stamp !== stamp) return undefined;
    const index = new CaseIndex(CompactEngine.decode(header.engine, bytes.subarray(4 + length)));
    for (const [id, f] of header.facts) index.setFacts(id, f);
    return index;
  } catch (err) {
    console.error('[falsetrace] search snapshot unreadable, rebuilding:', (err as Error).message);
    return undefined;
  }
}

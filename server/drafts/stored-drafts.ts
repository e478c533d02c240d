import * as Y from 'yjs';
import type { Db } from '../db/knex';
import type { Mapping } from '../../src/shared/chem';
import { docToMapping } from '../../src/shared/mapping-doc';
import { TtlCache } from '../cache/ttl-cache';
import { draftStamp, loadDraft, loadEvaluationInputs } from './drafts.service';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';

/**
 * Stored drafts (of mappings no live room holds) as the REST side reads them, kept between requests:
 * a page load of a mapping used to load the draft and its inputs from MariaDB and evaluate it in the
 * evaluation thread every time, and a thread list loaded the draft again for its bead names. Each
 * read now asks MariaDB one short question — the draft's stamp (drafts.service.ts: `draftStamp`),
 * which changes with the draft and with every input of its evaluation — and loads and evaluates only
 * when the stamp differs from the kept one. So there is nothing to invalidate: a change made by this
 * instance, another one, or a script in MariaDB is seen by the next read. Loads of one stamp that
 * arrive together share one load and one evaluation.
 */
export interface StoredDraft {
  stamp: string;
  inputs: EvaluationInputs;
  doc: Y.Doc;
  draft: Mapping;
}

interface Entry {
  stamp: string;
  loaded: Promise<StoredDraft | null>;
  result?: Promise<EvaluationResult>;
  derived: Map<string, unknown>;
}

export class StoredDrafts {
  private readonly entries: TtlCache<number, Entry>;
  /** Loads from MariaDB so far (each followed by at most one evaluation): for tests and the benchmark's notes. */
  loads = 0;

  constructor(
    private readonly db: Db,
    private readonly evaluate: (inputs: EvaluationInputs, draft: Mapping) => Promise<EvaluationResult>,
    options: { ttlMs: number; max: number } = { ttlMs: 10 * 60_000, max: 200 },
  ) {
    this.entries = new TtlCache(options.ttlMs, options.max);
  }

  /** The stored draft and its evaluation; null when there is no such mapping. */
  async read(mappingId: number): Promise<{ draft: Mapping; result: EvaluationResult } | null> {
    const entry = await this.entry(mappingId);
    const stored = entry && (await entry.loaded);
    if (!entry || !stored) return null;
    if (!entry.result) {
      const result = this.evaluate(stored.inputs, stored.draft);
      entry.result = result;
      // A failed evaluation is not kept: the next read tries again.
      result.catch(() => {
        if (entry.result === result) entry.result = undefined;
      });
    }
    return { draft: stored.draft, result: await entry.result };
  }

  /** `make(doc)`, computed once per stored state of the draft (e.g. the bead ids a thread list needs); the doc is shared: read it only. */
  async derived<T>(mappingId: number, name: string, make: (doc: Y.Doc) => T): Promise<T | null> {
    const entry = await this.entry(mappingId);
    const stored = entry && (await entry.loaded);
    if (!entry || !stored) return null;
    if (!entry.derived.has(name)) entry.derived.set(name, make(stored.doc));
    return entry.derived.get(name) as T;
  }

  private async entry(mappingId: number): Promise<Entry | null> {
    const stamp = await draftStamp(this.db, mappingId);
    if (stamp === null) {
      this.entries.delete(mappingId);
      return null;
    }
    const kept = this.entries.get(mappingId);
    if (kept?.stamp === stamp) return kept;
    const entry: Entry = { stamp, loaded: this.load(mappingId, stamp), derived: new Map() };
    this.entries.set(mappingId, entry);
    // A failed load is not kept.
    entry.loaded.catch(() => {
      if (this.entries.get(mappingId) === entry) this.entries.delete(mappingId);
    });
    return entry;
  }

  /**
   * Loaded after the stamp was read, so what is loaded is at least as new as the stamp says; a change
   * in between only makes the next read load again.
   */
  private async load(mappingId: number, stamp: string): Promise<StoredDraft | null> {
    this.loads++;
    const inputs = await loadEvaluationInputs(this.db, mappingId);
    if (!inputs) return null;
    const { doc } = await loadDraft(this.db, mappingId, inputs.model.atoms.length);
    return { stamp, inputs, doc, draft: docToMapping(doc) };
  }
}

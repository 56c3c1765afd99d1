/**
 * Answers to the lab's list and detail GETs of API scripts, kept in the web process and given again
 * while the database is unchanged: a script polling the readouts list gets the same JSON without the
 * token lookup, the query and the JSON text being made again.
 *
 * An answer is given again only when all of these hold:
 * - the same token (its SHA-256) asks for the same path and query;
 * - nothing was written since it was made to a table it read (Database.changeMark and tablesReadBy,
 *   change-counts.ts: a write by any process to a table an answer read ends it; a write to other
 *   tables does not, so a readout's progress or a worker's heartbeat leaves the studies list kept;
 *   an answer whose tables are not all counted ends at any write);
 * - it is younger than ANSWER_MAX_AGE_MS, and its token has not expired meanwhile;
 * - it was a 200 JSON answer of at most ANSWER_MAX_BYTES.
 * Requests for the same answer that arrive while it is being made wait for it instead of making it
 * again (a change ends many answers at once, and 50 scripts ask again together).
 *
 * Measured on the server-load bench's lab (50 clients, one web process, no readout): 2.2 ms of
 * server CPU per request without, 1.4–1.6 ms with (issue "Speed").
 */
import "server-only";
import type { KeptAnswer } from "@/lib/web/kept-answers";
import type { ChangeMark } from "../db";

/** Longest an answer is given again, ms: a time-derived field ("expired") is never older than this. */
export const ANSWER_MAX_AGE_MS = 1000;
/** Largest answer kept, bytes. */
export const ANSWER_MAX_BYTES = 1024 * 1024;
/** All answers kept by one process, bytes; the least recently given go first. */
export const ANSWERS_MAX_BYTES = 16 * 1024 * 1024;

interface Kept extends KeptAnswer {
  /** The mark's version at which it is known to hold. */
  version: string;
  /** Each table it read with its count then; null when it holds only at `version` (a table not counted). */
  reads: [table: string, count: number][] | null;
  /** Given again until then (ms since the epoch). */
  until: number;
}

export interface Made {
  response: Response;
  /** The answer may not be given again after this (a token's expiry), ms since the epoch. */
  validUntil?: number | null;
  /** The tables it was made from (Database.tablesReadBy); absent or null: it may depend on any. */
  reads?: readonly string[] | null;
}

export interface AnswerCacheOptions {
  maxAgeMs?: number;
  maxAnswerBytes?: number;
  maxBytes?: number;
  now?: () => number;
}

export class AnswerCache {
  private readonly kept = new Map<string, Kept>();
  private readonly making = new Map<string, { version: string; done: Promise<Kept | null> }>();
  private bytes = 0;
  /** Answers given again, and answers asked of the handler (for tests and the bench). */
  readonly counts = { given: 0, made: 0 };
  private readonly maxAgeMs: number;
  private readonly maxAnswerBytes: number;
  private readonly maxBytes: number;
  private readonly now: () => number;

  constructor(options: AnswerCacheOptions = {}) {
    this.maxAgeMs = options.maxAgeMs ?? ANSWER_MAX_AGE_MS;
    this.maxAnswerBytes = options.maxAnswerBytes ?? ANSWER_MAX_BYTES;
    this.maxBytes = options.maxBytes ?? ANSWERS_MAX_BYTES;
    this.now = options.now ?? (() => Date.now());
  }

  /** How many answers are kept, and their bytes. */
  get size(): { answers: number; bytes: number } {
    return { answers: this.kept.size, bytes: this.bytes };
  }

  /**
   * The answer for `key` with the database at `mark`: a kept one, or one being made for the same
   * key and mark, else `make`'s (kept when it qualifies). A thrown error is `make`'s caller's.
   */
  async answer(key: string, mark: ChangeMark, make: () => Promise<Made>): Promise<Response> {
    const kept = this.givenAgain(key, mark);
    if (kept) return responseOf(kept);
    // With nothing being made, no await before `making` is set: requests arriving together make it once.
    const meanwhile = this.madeMeanwhile(key, mark);
    const given = meanwhile && (await meanwhile);
    if (given) return responseOf(given);
    let settle!: (k: Kept | null) => void;
    const done = new Promise<Kept | null>((resolve) => (settle = resolve));
    this.making.set(key, { version: mark.version, done });
    try {
      const started = this.now();
      this.counts.made++;
      const { response, validUntil, reads } = await make();
      const type = response.headers.get("content-type") ?? "";
      if (response.status !== 200 || !type.startsWith("application/json")) {
        settle(null);
        return response;
      }
      const body = new Uint8Array(await response.arrayBuffer());
      const made: Kept = {
        version: mark.version,
        reads: readsAt(mark, reads),
        status: response.status,
        headers: [...response.headers],
        body,
        until: Math.min(started + this.maxAgeMs, validUntil ?? Infinity),
      };
      if (body.byteLength <= this.maxAnswerBytes) {
        const old = this.kept.get(key);
        if (old) this.forget(key, old);
        this.keep(key, made);
        this.evict();
        settle(made);
      } else settle(null);
      return responseOf(made);
    } catch (err) {
      settle(null);
      throw err;
    } finally {
      if (this.making.get(key)?.done === done) this.making.delete(key);
    }
  }

  /**
   * The answer answer() would give without making it: the kept one, or the one being made for the
   * same key and mark, once made (counted as given); null when it must be made. What each web
   * process's front door (lib/cli/front-door.ts) gives before Next routes the request.
   */
  async keptOrBeingMade(key: string, mark: ChangeMark): Promise<KeptAnswer | null> {
    return this.givenAgain(key, mark) ?? (await this.madeMeanwhile(key, mark));
  }

  /** The answer being made for `key` at `mark`, once made and if it may be given (counted as given); null when none is. */
  private madeMeanwhile(key: string, mark: ChangeMark): Promise<Kept | null> | null {
    const making = this.making.get(key);
    if (!making || making.version !== mark.version) return null;
    return making.done.then((made) => {
      if (!made || this.now() >= made.until) return null;
      this.counts.given++;
      return made;
    });
  }

  /** The kept answer for `key` with the database at `mark`, when it may be given again (counted as given). */
  private givenAgain(key: string, mark: ChangeMark): Kept | null {
    const kept = this.kept.get(key);
    if (!kept) return null;
    this.forget(key, kept);
    if (this.now() >= kept.until || !holdsAt(kept, mark)) return null;
    this.keep(key, kept); // most recently given last
    this.counts.given++;
    return kept;
  }

  private keep(key: string, k: Kept) {
    this.kept.set(key, k);
    this.bytes += k.body.byteLength;
  }

  private forget(key: string, k: Kept) {
    this.kept.delete(key);
    this.bytes -= k.body.byteLength;
  }

  /** The least recently given answers go until the rest fit. */
  private evict() {
    for (const [key, k] of this.kept) {
      if (this.bytes <= this.maxBytes) break;
      this.forget(key, k);
    }
  }
}

/** Each table read with its count at `mark`; null when one is not counted (or the tables are unknown). */
function readsAt(mark: ChangeMark, reads: readonly string[] | null | undefined): Kept["reads"] {
  if (!reads) return null;
  const out: [string, number][] = [];
  for (const table of reads) {
    const count = mark.tables.get(table);
    if (count === undefined) return null;
    out.push([table, count]);
  }
  return out;
}

/** Whether a kept answer still holds at `mark`: same version, or no table it read written since (then noted at this version). */
function holdsAt(kept: Kept, mark: ChangeMark): boolean {
  if (kept.version === mark.version) return true;
  if (!kept.reads || !kept.reads.every(([table, count]) => mark.tables.get(table) === count)) return false;
  kept.version = mark.version;
  return true;
}

// Response copies a Uint8Array body (undici), so the kept bytes stay whole.
const responseOf = (k: KeptAnswer) => new Response(k.body, { status: k.status, headers: k.headers });

// Keeps the state in memory and, when a file is given, mirrors it there after each change
// so a restarted fake still knows its accounts, sessions and events.
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { dirname } from "node:path";
import { emptyState, type FakeState } from "./state";

// Idempotency keys are kept for 24 hours, as the provider documents (from memory).
const IDEMPOTENCY_TTL_SECONDS = 24 * 60 * 60;

export class FakeStore {
  state: FakeState;
  private pending = false;
  private closed = false;

  constructor(private readonly file?: string) {
    this.state = file && existsSync(file) ? loadState(file) : emptyState();
  }

  /** Coalesces the writes of one request (and its events) into one file write. */
  changed(): void {
    if (!this.file || this.pending || this.closed) return;
    this.pending = true;
    setImmediate(() => {
      if (this.pending) this.flush();
    });
  }

  flush(): void {
    this.pending = false;
    if (!this.file || this.closed) return;
    mkdirSync(dirname(this.file), { recursive: true });
    const temp = `${this.file}.${process.pid}.tmp`;
    writeFileSync(temp, JSON.stringify(this.state));
    renameSync(temp, this.file);
  }

  /** Writes what is left and stops writing, so nothing recreates the file after shutdown. */
  close(): void {
    this.flush();
    this.closed = true;
  }

  pruneIdempotency(now: number): void {
    for (const [key, entry] of Object.entries(this.state.idempotency)) {
      if (now - entry.created > IDEMPOTENCY_TTL_SECONDS) delete this.state.idempotency[key];
    }
  }

  reset(): void {
    const offset = this.state.clockOffsetSeconds;
    this.state = emptyState();
    this.state.clockOffsetSeconds = offset;
    this.changed();
  }
}

function loadState(file: string): FakeState {
  const parsed = JSON.parse(readFileSync(file, "utf8")) as Partial<FakeState>;
  if (parsed.version !== 1) throw new Error(`payments fake: ${file} is not a store file of version 1`);
  return { ...emptyState(), ...parsed } as FakeState;
}

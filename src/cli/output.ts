import { once } from 'node:events';
import { createWriteStream, rmSync, type WriteStream } from 'node:fs';

/**
 * Where output goes: stdout or --out FILE. Writes wait for the stream to drain, so a fast
 * producer never piles output up in memory. The file is created only when the first byte is
 * ready (an invalid request leaves no empty file), and removed again if the run fails half-way.
 */
export class Sink {
  private file: WriteStream | undefined;
  private written = false;

  constructor(
    private readonly path: string | undefined,
    private readonly stdout: NodeJS.WritableStream & { isTTY?: boolean } = process.stdout,
  ) {}

  get isTerminal(): boolean {
    return this.path === undefined && this.stdout.isTTY === true;
  }

  async write(text: string): Promise<void> {
    if (text.length === 0) return;
    const stream = this.stream();
    this.written = true;
    if (!stream.write(text)) await once(stream, 'drain');
  }

  /** Flushes and closes the file (stdout stays open). */
  async finish(): Promise<void> {
    if (this.path === undefined) return;
    const stream = this.stream();
    stream.end();
    await once(stream, 'finish');
  }

  /** After a failure: close and delete a partly written file. */
  abandon(): void {
    if (this.file) {
      this.file.destroy();
      if (this.written && this.path) rmSync(this.path, { force: true });
    }
  }

  private stream(): NodeJS.WritableStream {
    if (this.path === undefined) return this.stdout;
    this.file ??= createWriteStream(this.path);
    return this.file;
  }
}

/**
 * A progress bar on stderr for long runs: drawn only when stderr is a terminal, and only once
 * a run has taken over a second, so short runs and pipelines print nothing extra.
 */
export class Progress {
  private readonly startedAt = Date.now();
  private lastDraw = 0;
  private drawn = false;
  private done = 0;

  constructor(
    private readonly total: number,
    private readonly stderr: NodeJS.WritableStream & { isTTY?: boolean } = process.stderr,
    private readonly enabled: boolean = stderr.isTTY === true,
    /** Quiet period before the bar appears (PARTSMITH_PROGRESS_AFTER_MS; default one second). */
    private readonly afterMs: number = 1000,
    /** What is counted, e.g. "samples" or "members". */
    private readonly unit: string = 'samples',
  ) {}

  advance(samples: number): void {
    this.done += samples;
    if (!this.enabled) return;
    const now = Date.now();
    if (now - this.startedAt < this.afterMs || now - this.lastDraw < 100) return;
    this.lastDraw = now;
    this.drawn = true;
    const fraction = this.total > 0 ? Math.min(1, this.done / this.total) : 1;
    const width = 30;
    const filled = Math.round(fraction * width);
    const rate = this.done / ((now - this.startedAt) / 1000);
    this.stderr.write(
      `\r[${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${(fraction * 100).toFixed(0).padStart(3)}% ${this.done}/${this.total} ${this.unit}, ${Math.round(rate)}/s `,
    );
  }

  finish(): void {
    if (this.drawn) this.stderr.write('\r\x1b[2K');
  }
}

// A pass-through stream that joins the chunks written to it within one turn of the event loop.
// React's server renderer writes a page in 2 kB pieces; each piece would otherwise cross two stream
// conversions (Node → web → Node) and reach the socket as its own write. Joined, a page whose data
// is all loaded goes out in one chunk, and a page that streams (Suspense) still flushes each
// boundary as it is ready: nothing waits longer than the current turn.
import { Transform, type TransformCallback, type TransformOptions } from "node:stream";

export class CoalescingStream extends Transform {
  private parts: Buffer[] = [];
  private size = 0;
  private scheduled = false;

  constructor(options: TransformOptions = {}) {
    super(options);
  }

  override _transform(chunk: Buffer | string, encoding: BufferEncoding, callback: TransformCallback) {
    const buffer = typeof chunk === "string" ? Buffer.from(chunk, encoding) : chunk;
    this.parts.push(buffer);
    this.size += buffer.length;
    if (!this.scheduled) {
      this.scheduled = true;
      setImmediate(() => this.release());
    }
    callback();
  }

  override _flush(callback: TransformCallback) {
    this.release();
    callback();
  }

  private release() {
    this.scheduled = false;
    if (this.parts.length === 0) return;
    const joined = this.parts.length === 1 ? this.parts[0]! : Buffer.concat(this.parts, this.size);
    this.parts = [];
    this.size = 0;
    this.push(joined);
  }
}

// A streaming multipart/form-data reader (RFC 7578 framing): file bytes are handed on as they
// arrive, so size limits apply while receiving and an interrupted upload leaves its prefix on disk.
export type PartInfo = { name: string | null; filename: string | null; contentType: string | null };

export type PartSink = {
  start(part: PartInfo): void;
  data(chunk: Buffer): void;
  end(): void;
};

export type MultipartReader = {
  push(chunk: Buffer): void;
  /** True when the closing delimiter was seen. */
  readonly complete: boolean;
};

const MAX_HEADER_BYTES = 16 * 1024;

export function boundaryOf(contentType: string | undefined): string | null {
  if (!contentType || !/^multipart\/form-data\b/i.test(contentType)) return null;
  const match = /boundary=(?:"([^"]+)"|([^;\s]+))/i.exec(contentType);
  return match?.[1] ?? match?.[2] ?? null;
}

function parsePartHeaders(block: string): PartInfo {
  let name: string | null = null;
  let filename: string | null = null;
  let contentType: string | null = null;
  for (const line of block.split("\r\n")) {
    const colon = line.indexOf(":");
    if (colon < 0) continue;
    const field = line.slice(0, colon).trim().toLowerCase();
    const value = line.slice(colon + 1).trim();
    if (field === "content-disposition") {
      name = /(?:^|;)\s*name="([^"]*)"/i.exec(value)?.[1] ?? null;
      filename = /(?:^|;)\s*filename="([^"]*)"/i.exec(value)?.[1] ?? null;
    } else if (field === "content-type") {
      contentType = value;
    }
  }
  return { name, filename, contentType };
}

export function createMultipartReader(boundary: string, sink: PartSink): MultipartReader {
  // Treating the body as if it began with CRLF makes every delimiter the same byte string.
  const delimiter = Buffer.from(`\r\n--${boundary}`);
  let buffer: Buffer = Buffer.from("\r\n");
  let state: "preamble" | "after-delimiter" | "headers" | "body" | "done" = "preamble";
  let complete = false;

  const step = (): boolean => {
    switch (state) {
      case "preamble": {
        const at = buffer.indexOf(delimiter);
        if (at < 0) {
          buffer = buffer.subarray(Math.max(0, buffer.length - delimiter.length + 1));
          return false;
        }
        buffer = buffer.subarray(at + delimiter.length);
        state = "after-delimiter";
        return true;
      }
      case "after-delimiter": {
        if (buffer.length < 2) return false;
        const marker = buffer.subarray(0, 2).toString("latin1");
        buffer = buffer.subarray(2);
        if (marker === "--") {
          state = "done";
          complete = true;
          return false;
        }
        if (marker !== "\r\n") throw new Error("malformed multipart body: bad delimiter line");
        state = "headers";
        return true;
      }
      case "headers": {
        const at = buffer.indexOf("\r\n\r\n");
        if (at < 0) {
          if (buffer.length > MAX_HEADER_BYTES) throw new Error("malformed multipart body: part headers too long");
          return false;
        }
        sink.start(parsePartHeaders(buffer.subarray(0, at).toString("utf8")));
        buffer = buffer.subarray(at + 4);
        state = "body";
        return true;
      }
      case "body": {
        const at = buffer.indexOf(delimiter);
        if (at < 0) {
          // Bytes that could begin a delimiter split across chunks stay behind.
          const safe = buffer.length - delimiter.length + 1;
          if (safe > 0) {
            sink.data(buffer.subarray(0, safe));
            buffer = buffer.subarray(safe);
          }
          return false;
        }
        if (at > 0) sink.data(buffer.subarray(0, at));
        sink.end();
        buffer = buffer.subarray(at + delimiter.length);
        state = "after-delimiter";
        return true;
      }
      case "done":
        return false;
    }
  };

  return {
    push(chunk) {
      if (state === "done") return;
      buffer = buffer.length ? Buffer.concat([buffer, chunk]) : chunk;
      while (step());
    },
    get complete() {
      return complete;
    },
  };
}

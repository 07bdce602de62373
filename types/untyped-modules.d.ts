// Declarations for the few packages that ship no types; only what the project uses.
declare module 's3rver' {
  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: { name: string; configs: unknown[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(callback?: () => void): void;
  }
}

declare module 'on-headers' {
  import type { ServerResponse } from 'node:http';
  export default function onHeaders(res: ServerResponse, listener: () => void): void;
}

declare module 'autocannon' {
  namespace autocannon {
    /** One request of a sequence each connection sends in turn, starting over after the last. */
    interface SequenceRequest {
      method?: string;
      path?: string;
      headers?: Record<string, string>;
      body?: string;
      /** Builds the request from the connection's context; null ends the sequence early (not on the first). */
      setupRequest?: (request: SequenceRequest, context: Record<string, unknown>) => SequenceRequest | null;
      onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
    }
    interface Options {
      url: string;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      connections?: number;
      duration?: number;
      requests?: SequenceRequest[];
    }
    interface Histogram {
      average: number;
      p50: number;
      p99: number;
    }
    interface Result {
      requests: Histogram;
      latency: Histogram;
      errors: number;
      timeouts: number;
    }
  }
  function autocannon(options: autocannon.Options, callback: (error: Error | null, result: autocannon.Result) => void): unknown;
  export default autocannon;
}

declare module 'subset-font' {
  interface SubsetFontOptions {
    targetFormat?: 'sfnt' | 'woff' | 'woff2' | 'truetype';
    keepAllGlyphs?: boolean;
    preserveNameIds?: number[];
  }
  export default function subsetFont(font: Buffer, text: string | undefined, options?: SubsetFontOptions): Promise<Buffer>;
}

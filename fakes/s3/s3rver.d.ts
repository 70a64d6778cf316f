// s3rver ships no types; this covers the part the S3 fake uses.
declare module 's3rver' {
  import type { IncomingMessage, ServerResponse } from 'node:http';

  interface S3rverOptions {
    directory: string;
    silent?: boolean;
    vhostBuckets?: boolean;
    allowMismatchedSignatures?: boolean;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  }

  export default class S3rver {
    constructor(options: S3rverOptions);
    configureBuckets(): Promise<void>;
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
    on(event: 'error', listener: (err: Error & { status?: number }) => void): this;
  }
}

declare module 's3rver/lib/models/account.js' {
  interface AWSAccount {
    createKeyPair(accessKeyId: string, secretAccessKey: string): void;
    revokeAccessKey(accessKeyId: string): void;
  }
  const AWSAccountClass: { DUMMY_ACCOUNT: AWSAccount };
  export default AWSAccountClass;
}

// s3rver ships no types; this covers the part scripts/fakes/fake-s3.ts uses.
declare module 's3rver' {
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory?: string;
    configureBuckets?: { name: string; configs: (string | Buffer)[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<unknown>;
    close(): Promise<void>;
  }
}

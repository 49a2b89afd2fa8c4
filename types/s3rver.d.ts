// s3rver ships no types; only what scripts/fakes.ts uses is declared.
declare module "s3rver" {
  type Options = { port?: number; address?: string; directory: string; silent?: boolean; configureBuckets?: { name: string; configs?: (string | Buffer)[] }[] };
  export default class S3rver {
    constructor(options: Options);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}

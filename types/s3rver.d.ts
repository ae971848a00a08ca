declare module "s3rver" {
  type Options = {
    port?: number;
    address?: string;
    directory: string;
    silent?: boolean;
    configureBuckets?: { name: string; configs?: unknown[] }[];
  };
  export default class S3rver {
    constructor(options: Options);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}

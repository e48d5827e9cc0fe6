import { join } from 'node:path';
import type { Config } from '../config';
import { DiskRawStore, type RawStore } from './raw-store';
import { createS3Client, S3RawStore } from './s3-raw-store';

/** The bucket when S3_BUCKET is set, else the folder `DATA_DIR/raw`. */
export function openRawStore(config: Pick<Config, 'dataDir' | 's3'>): RawStore {
  if (config.s3) return new S3RawStore(createS3Client(config.s3), config.s3.bucket);
  return new DiskRawStore(join(config.dataDir, 'raw'));
}

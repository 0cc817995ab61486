import type { Config } from '../../config';
import type { FileStore } from './file-store';
import { LocalFileStore } from './local-file-store';

/** The file store the configuration names (local disk today); uploads and generated documents share it. */
export function fileStoreFromConfig(config: Config): FileStore {
  return new LocalFileStore(config.uploads.dir);
}

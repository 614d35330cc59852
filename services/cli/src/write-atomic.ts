/** Writes a file via a temporary sibling and a rename, so a failed run leaves no partial file. */
import { rename, writeFile, rm } from 'node:fs/promises';

export async function writeFileAtomic(path: string, data: string | Buffer): Promise<void> {
  const tmp = `${path}.tmp-${process.pid}`;
  try {
    await writeFile(tmp, data);
    await rename(tmp, path);
  } catch (err) {
    await rm(tmp, { force: true });
    throw err;
  }
}

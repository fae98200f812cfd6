import { constants } from 'node:fs';
import { open, rename, rm, stat } from 'node:fs/promises';
import { dirname } from 'node:path';

/** Writes bytes to a new file and flushes them to the disk before returning. */
export async function writeDurably(path: string, bytes: Uint8Array): Promise<void> {
  const handle = await open(path, constants.O_WRONLY | constants.O_CREAT | constants.O_EXCL, 0o640);
  try {
    let offset = 0;
    while (offset < bytes.byteLength) {
      const { bytesWritten } = await handle.write(bytes, offset, bytes.byteLength - offset);
      offset += bytesWritten;
    }
    await handle.sync();
  } finally {
    await handle.close();
  }
}

export async function fsyncFile(path: string): Promise<void> {
  const handle = await open(path, 'r');
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
}

/** Makes a rename survive a power cut: the directory entry itself is flushed. */
export async function fsyncDir(dir: string): Promise<void> {
  const handle = await open(dir, 'r');
  try {
    await handle.sync();
  } catch {
    // Some filesystems refuse fsync on a directory; the rename is still atomic there.
  } finally {
    await handle.close();
  }
}

export async function exists(path: string): Promise<boolean> {
  try {
    await stat(path);
    return true;
  } catch {
    return false;
  }
}

/**
 * Moves a flushed temp file to its final name. Names are content-derived, so when the final
 * file is there already it holds the same bytes: keep it and drop the temp copy.
 * Returns whether this call created the final file.
 */
export async function publish(tempPath: string, finalPath: string): Promise<boolean> {
  if (await exists(finalPath)) {
    await rm(tempPath, { force: true });
    return false;
  }
  await rename(tempPath, finalPath);
  await fsyncDir(dirname(finalPath));
  return true;
}

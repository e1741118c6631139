import { createHash } from 'node:crypto';
import { mkdir, readFile, rename, stat, writeFile } from 'node:fs/promises';
import { join } from 'node:path';

/** Uploaded files on disk, named by the SHA-256 of their content: the same file is kept once. */
export class UploadStore {
  constructor(private readonly dir: string) {}

  static hash(content: Buffer): string {
    return createHash('sha256').update(content).digest('hex');
  }

  async save(content: Buffer): Promise<string> {
    const sha = UploadStore.hash(content);
    await mkdir(this.dir, { recursive: true });
    const path = join(this.dir, sha);
    try {
      await stat(path);
    } catch {
      // Write beside, then rename: a crash never leaves a half-written file under the final name.
      const partial = `${path}.partial-${process.pid}`;
      await writeFile(partial, content);
      await rename(partial, path);
    }
    return sha;
  }

  read(sha: string): Promise<Buffer> {
    return readFile(join(this.dir, sha));
  }
}

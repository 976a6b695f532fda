import { randomUUID } from 'node:crypto';
import { copyFile, link, mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

/**
 * Where geodata files are kept: one folder per organisation under the configured directory, each
 * file under a random name recorded in its database row (so names from uploads never reach the
 * file system). Files are written once and removed with their row.
 */
export class GeodataStore {
  constructor(private readonly dir: string) {}

  /** Absolute path of a stored file. */
  path(organisationId: number, name: string): string {
    if (!/^[\w.-]+$/.test(name)) throw new Error(`not a stored geodata name: ${name}`);
    return path.join(this.dir, String(organisationId), name);
  }

  /** A new name with the given ending, e.g. '.tif'. */
  newName(ending: string): string {
    return `${randomUUID()}${ending}`;
  }

  /** A new name with the ending of an uploaded file's name (e.g. '.tif'), never any other part of it. */
  nameFor(originalName: string): string {
    return this.newName(path.extname(originalName).toLowerCase().replace(/[^.\w]/g, '') || '.bin');
  }

  /**
   * Keeps a stored file under a second name too (a hard link, else a copy): each catchment made
   * from one upload keeps the file as its own, and removing one name leaves the others.
   */
  async share(organisationId: number, name: string, newName: string): Promise<void> {
    const from = this.path(organisationId, name);
    const to = this.path(organisationId, newName);
    try {
      await link(from, to);
    } catch {
      await copyFile(from, to);
    }
  }

  /** Moves an uploaded temporary file into the store (copies when the temporary folder is on another disk). */
  async keep(organisationId: number, tempPath: string, name: string): Promise<void> {
    const target = this.path(organisationId, name);
    await mkdir(path.dirname(target), { recursive: true });
    try {
      await rename(tempPath, target);
    } catch {
      await copyFile(tempPath, target);
    }
  }

  async write(organisationId: number, name: string, bytes: Uint8Array): Promise<void> {
    const target = this.path(organisationId, name);
    await mkdir(path.dirname(target), { recursive: true });
    await writeFile(target, bytes);
  }

  async read(organisationId: number, name: string): Promise<Buffer> {
    return readFile(this.path(organisationId, name));
  }

  async remove(organisationId: number, names: readonly string[]): Promise<void> {
    await Promise.all(names.map((name) => rm(this.path(organisationId, name), { force: true })));
  }
}

/**
 * Remembered column mappings, one file per export layout under `<dataDir>/mappings/`.
 * The host stores the importer's mapping text as it is; the renderer's worker parses and
 * checks it with the importer, so the format has one owner.
 */
import { mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeFileAtomic } from '../atomic-write';

const LAYOUT_KEY = /^[A-Za-z0-9_-]{1,128}$/;

export function createMappingStore(dataDir: string) {
  const dir = join(dataDir, 'mappings');
  return {
    save(layoutKey: string, mappingJson: string): void {
      if (!LAYOUT_KEY.test(layoutKey)) throw new Error(`'${layoutKey}' is not a layout key`);
      mkdirSync(dir, { recursive: true });
      writeFileAtomic(join(dir, `${layoutKey}.json`), mappingJson);
    },
    list(): { layoutKey: string; mappingJson: string }[] {
      let names: string[];
      try {
        names = readdirSync(dir);
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
        throw error;
      }
      return names
        .sort()
        .filter((name) => name.endsWith('.json') && LAYOUT_KEY.test(name.slice(0, -5)))
        .map((name) => ({ layoutKey: name.slice(0, -5), mappingJson: readFileSync(join(dir, name), 'utf8') }));
    },
  };
}

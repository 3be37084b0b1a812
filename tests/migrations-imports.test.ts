// migrations/ and shared/db/ must not import each other in a circle: shared/db applies
// the migrations (migrate.ts imports migrations/index.ts), so the migrations take their
// DDL helpers from migrations/ddl.ts and import nothing from shared/.
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const dir = fileURLToPath(new URL('../migrations/', import.meta.url));

describe('migrations/ imports', () => {
  it('reach nothing under shared/ (no circle with shared/db)', () => {
    const files = readdirSync(dir).filter((f) => f.endsWith('.ts'));
    expect(files).toContain('0001_initial.ts');
    const outside: string[] = [];
    for (const f of files) {
      const code = readFileSync(path.join(dir, f), 'utf8');
      for (const m of code.matchAll(/(?:import|export)\s[^'"]*?['"]([^'"]+)['"]/g)) {
        if (m[1].startsWith('.') && !path.resolve(dir, m[1]).startsWith(dir)) outside.push(`${f} → ${m[1]}`);
      }
    }
    expect(outside).toEqual([]);
  });
});

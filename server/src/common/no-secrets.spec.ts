import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const repoRoot = fileURLToPath(new URL('../../../', import.meta.url));
const tracked = execFileSync('git', ['ls-files'], { cwd: repoRoot, encoding: 'utf8' })
  .split('\n')
  .filter(Boolean);

/** What would be a secret in the repository: keys, tokens, the generated JWT secret, databases. */
const SECRET_TEXT = [
  /-----BEGIN [A-Z ]*PRIVATE KEY-----/,
  /eyJhbGciOi[A-Za-z0-9_-]{10,}\.[A-Za-z0-9_-]{10,}\.[A-Za-z0-9_-]{10,}/, // a signed JWT
  /JWT_SECRET\s*[:=]\s*['"][^'"]{8,}['"]/,
];

describe('the repository', () => {
  it('holds no data files with secrets: no database, no generated JWT secret, no uploads', () => {
    expect(
      tracked.filter(
        (file) => /(^|\/)(jwt-secret|.*\.sqlite(-wal|-shm)?|\.env)$/.test(file) || file.startsWith('data/'),
      ),
    ).toEqual([]);
  });

  it('holds no private keys, signed tokens or hard-coded signing secrets in its text', () => {
    const text = tracked.filter(
      (file) =>
        /\.(ts|tsx|js|mjs|json|md|sql|css|html|ya?ml|sh)$/.test(file) && !file.endsWith('package-lock.json'),
    );
    const hits = text.flatMap((file) => {
      const content = readFileSync(join(repoRoot, file), 'utf8');
      return SECRET_TEXT.filter((pattern) => pattern.test(content)).map(
        (pattern) => `${file}: ${pattern.source}`,
      );
    });
    expect(hits).toEqual([]);
  });
});

import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The dependency rules of DEVELOPERS.md, checked on the source text so a change that breaks
 * them fails the build: shared code imports neither side, the web app never imports the API,
 * features do not import each other, the engine stays pure and deterministic, and the API has one
 * composition root that alone creates services and mounts routes.
 */
function sourceFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(entry.name) ? [full] : [];
  });
}

function importsOf(file: string): string[] {
  const text = fs.readFileSync(file, 'utf8');
  return [
    ...text.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g),
  ].map((match) => match[1] ?? match[2]);
}

/** Where an import lands, as a path relative to the repository root (aliases resolved). */
function target(file: string, specifier: string): string {
  if (specifier.startsWith('@shared/')) return path.join('shared', specifier.slice('@shared/'.length));
  if (specifier.startsWith('@web/')) return path.join('web/src', specifier.slice('@web/'.length));
  if (specifier.startsWith('.')) return path.relative('.', path.resolve(path.dirname(file), specifier));
  return specifier;
}

function violations(
  root: string,
  isForbidden: (file: string, landsIn: string, specifier: string) => boolean,
) {
  return sourceFiles(root).flatMap((file) =>
    importsOf(file)
      .filter((specifier) => isForbidden(file, target(file, specifier), specifier))
      .map((specifier) => `${file} imports ${specifier}`),
  );
}

/** Value imports (not `import type`) of a file: the names and where they come from. */
function valueImportsOf(file: string): { names: string[]; specifier: string }[] {
  const text = fs.readFileSync(file, 'utf8');
  return [...text.matchAll(/import\s+(type\s+)?\{([^}]*)\}\s*from\s*['"]([^'"]+)['"]/g)]
    .filter((match) => !match[1])
    .map((match) => ({
      names: match[2]
        .split(',')
        .map((name) => name.trim())
        .filter((name) => name && !name.startsWith('type '))
        .map((name) => name.split(/\s+as\s+/)[0]),
      specifier: match[3],
    }));
}

const SERVICES = 'api/src/services/';
const COMPOSITION = 'api/src/composition/';

describe('architecture', () => {
  it('keeps shared/ free of web/ and api/', () => {
    expect(violations('shared', (_f, landsIn) => /^(web|api)\//.test(landsIn))).toEqual([]);
  });

  it('keeps the web app from importing the API', () => {
    expect(violations('web/src', (_f, landsIn) => landsIn.startsWith('api/'))).toEqual([]);
  });

  it('keeps features from importing each other', () => {
    const featureOf = (p: string) => p.match(/^web\/src\/features\/([^/]+)/)?.[1];
    const found = violations('web/src/features', (file, landsIn) => {
      const other = featureOf(landsIn);
      return other !== undefined && other !== featureOf(path.relative('.', file));
    });
    expect(found).toEqual([]);
  });

  it('keeps the engine pure: no Node or browser APIs, no clock, no Math.random', () => {
    const impure = ['shared/engine', 'shared/safety'].flatMap(sourceFiles).flatMap((file) => {
      const text = fs.readFileSync(file, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
      const problems = [];
      if (/from\s+['"]node:|require\(/.test(text)) problems.push('Node import');
      if (/Math\.random\s*\(/.test(text)) problems.push('Math.random');
      if (/Date\.now\s*\(|new Date\s*\(|performance\.now\s*\(/.test(text)) problems.push('clock');
      if (/\b(window|document|localStorage|fetch)\b/.test(text)) problems.push('browser API');
      return problems.map((problem) => `${file}: ${problem}`);
    });
    expect(impure).toEqual([]);
  });

  it('keeps services free of routes and HTTP: they never import routes/, http/ or the composition root', () => {
    const found = violations('api/src/services', (_f, landsIn) =>
      /^api\/src\/(routes|http|composition)\/|^api\/src\/app(\.ts)?$/.test(landsIn),
    );
    expect(found).toEqual([]);
  });

  it('lets only the composition root import route modules', () => {
    const found = violations('api/src', (file, landsIn) => {
      const from = path.relative('.', file);
      return (
        landsIn.startsWith('api/src/routes/') &&
        !from.startsWith(COMPOSITION) &&
        !from.startsWith('api/src/routes/')
      );
    });
    expect(found).toEqual([]);
  });

  it('creates services only in the composition root', () => {
    const found = sourceFiles('api/src').flatMap((file) => {
      const from = path.relative('.', file);
      if (from.startsWith(COMPOSITION)) return [];
      return valueImportsOf(file).flatMap(({ names, specifier }) => {
        const landsIn = target(file, specifier);
        const isOtherService = landsIn.startsWith(SERVICES) && path.dirname(landsIn) !== path.dirname(from);
        return isOtherService
          ? names.filter((name) => /^create[A-Z]/.test(name)).map((name) => `${from} imports ${name}`)
          : [];
      });
    });
    expect(found).toEqual([]);
  });

  it('has no listeners on the audit trail: status changes are explicit calls in the writing service', () => {
    const found = sourceFiles('api/src').filter((file) =>
      /\bonAppended\b|audit\w*\.on\(/.test(fs.readFileSync(file, 'utf8')),
    );
    expect(found).toEqual([]);
  });

  it('keeps host transcendental functions out of everything that feeds the digest', () => {
    // ECMA-262 leaves Math.exp, Math.log, Math.sin, ... "implementation-approximated": Node and a
    // browser may differ in the last bit, and one bit changes the digest. The engine's own
    // functions (shared/engine/numerics) use exactly specified double arithmetic only. sqrt,
    // abs, floor, round, min, max, fround and imul are exact and stay allowed; `**` does not:
    // engines evaluate it with their own pow.
    const hostMath =
      /\bMath\.(exp|expm1|log|log1p|log2|log10|sin|cos|tan|asin|acos|atan|atan2|sinh|cosh|tanh|asinh|acosh|atanh|pow|hypot|cbrt)\b/;
    const found = ['shared/engine', 'shared/bundle', 'shared/safety'].flatMap((root) =>
      sourceFiles(root).flatMap((file) => {
        const text = fs.readFileSync(file, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
        return text.split('\n').flatMap((line, index) => {
          const problems = [];
          const call = hostMath.exec(line);
          if (call) problems.push(`${file}:${index + 1}: ${call[0]}`);
          if (/[\w)\]]\s*\*\*\s*[\w(]/.test(line)) problems.push(`${file}:${index + 1}: ** operator`);
          return problems;
        });
      }),
    );
    expect(found).toEqual([]);
  });
});

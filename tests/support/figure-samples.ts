import fs from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { TestApp } from './test-app';

interface FigureSample {
  path: string;
  attach?: { field: string; file: string };
  fields?: Record<string, string>;
}

let counter = 0;
/** A plain SVG with bytes of its own each call, so no upload is a duplicate of another. */
export function freshFigureFile(): string {
  const file = path.join(tmpdir(), `figure-${process.pid}-${counter++}.svg`);
  fs.writeFileSync(
    file,
    `<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><title>sample ${counter} ${Date.now()}</title></svg>`,
  );
  return file;
}

const CAPTION = { caption: 'Timeline · matrix replay · step 1 · 0.10 s' };

/** Role-matrix samples for the figure routes, over the matrix's case. */
export function figureSamples(
  app: () => TestApp,
): Record<string, (f: { caseId: string }) => Promise<FigureSample> | FigureSample> {
  let shared: Promise<string> | undefined;
  const sharedFigure = (caseId: string) =>
    (shared ??= app()
      .tokenFor('investigator')
      .then((token) =>
        request(app().app)
          .post(`/api/cases/${caseId}/figures`)
          .set('Authorization', `Bearer ${token}`)
          .field(CAPTION)
          .attach('figure', freshFigureFile()),
      )
      .then((res) => {
        if (res.status !== 201) throw new Error(`save figure: got ${res.status} ${JSON.stringify(res.body)}`);
        return res.body.figure.id as string;
      }));
  return {
    'post /cases/:id/figures': (f) => ({
      path: `/api/cases/${f.caseId}/figures`,
      attach: { field: 'figure', file: freshFigureFile() },
      fields: CAPTION,
    }),
    'get /cases/:id/figures': (f) => ({ path: `/api/cases/${f.caseId}/figures` }),
    'get /figures/:id/file': async (f) => ({ path: `/api/figures/${await sharedFigure(f.caseId)}/file` }),
  };
}

import { z } from 'zod';
import { parseEmptyBody } from '../../../shared/contracts/empty-body';
import { ZFindingsDraft, ZReturnRequest, ZSignoffRequest } from '../../../shared/contracts/findings';
import { ROLES } from '../../../shared/roles';
import { SAFETY_CAUTION } from '../../../shared/safety-caution';
import type { RouteSpec } from '../http/route-spec';
import type { FindingsService } from '../services/findings/findings-service';
import type { ReviewService } from '../services/findings/review-service';
import { ZCaseParams } from './cases';

const ZVersionParams = ZCaseParams.extend({
  v: z.coerce.number().int().min(1, 'Version numbers start at 1'),
});
const ZDiffQuery = z.object({ against: z.coerce.number().int().min(1).optional() });

export function findingsRoutes(findings: FindingsService, reviews: ReviewService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/findings',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await findings.getFindings(ZCaseParams.parse(req.params).id, req.user));
      },
    },
    {
      method: 'get',
      path: '/cases/:id/evidence-names',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await findings.getEvidenceNames(ZCaseParams.parse(req.params).id, req.user));
      },
    },
    {
      method: 'put',
      path: '/cases/:id/findings',
      access: ['investigator'],
      audit: { action: 'findings.save' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await findings.saveDraft(id, ZFindingsDraft.parse(req.body), req.user));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/findings/submit',
      access: ['investigator'],
      audit: { action: 'findings.submit' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        parseEmptyBody(req.body);
        const submitted = await findings.submit(id, req.user);
        res.status(201).json({ ...submitted, safetyCaution: SAFETY_CAUTION });
      },
    },
    {
      method: 'get',
      path: '/cases/:id/findings/versions',
      access: ROLES,
      handler: async (req, res) => {
        res.json({ items: await findings.listVersions(ZCaseParams.parse(req.params).id, req.user) });
      },
    },
    {
      method: 'get',
      path: '/cases/:id/findings/versions/:v',
      access: ROLES,
      handler: async (req, res) => {
        const { id, v } = ZVersionParams.parse(req.params);
        res.json(await reviews.getVersion(id, v, req.user));
      },
    },
    {
      method: 'get',
      path: '/cases/:id/findings/versions/:v/diff',
      access: ROLES,
      handler: async (req, res) => {
        const { id, v } = ZVersionParams.parse(req.params);
        const { against } = ZDiffQuery.parse(req.query);
        res.json(await findings.diffVersions(id, against ?? Math.max(1, v - 1), v, req.user));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/findings/versions/:v/signoff',
      access: ['reviewer'],
      audit: { action: 'findings.signoff' },
      handler: async (req, res) => {
        const { id, v } = ZVersionParams.parse(req.params);
        ZSignoffRequest.parse(req.body);
        res.status(201).json(await reviews.signOff(id, v, req.user));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/findings/versions/:v/return',
      access: ['reviewer'],
      audit: { action: 'findings.return' },
      handler: async (req, res) => {
        const { id, v } = ZVersionParams.parse(req.params);
        const { comment } = ZReturnRequest.parse(req.body);
        res.json(await reviews.returnVersion(id, v, comment, req.user));
      },
    },
  ];
}

import type { WorkspaceEvidenceSource } from '../../archive/collect-case-evidence';
import type { AppConfig } from '../../config';
import type { RouteSpec } from '../../http/route-spec';
import { archiveRoutes } from '../../routes/archives';
import type { BundlesService } from '../bundles/bundles-service';
import type { CasesService } from '../cases/cases-service';
import type { EvidenceStore } from '../evidence/evidence-store';
import type { CaseWork } from '../lifecycle/case-work';
import type { ReplaysService } from '../replays/replays-service';
import { createArchiveService } from './archive-service';

/**
 * Wires the evidence archive to the services it reads, so `createApp` adds it in one line.
 * `workspace` (bookmarks and saved queries) is optional: without it those files are left out.
 */
export function createCaseArchives(deps: {
  config: AppConfig;
  cases: CasesService;
  bundles: BundlesService;
  replays: ReplaysService;
  evidence: EvidenceStore;
  derivedDir: string;
  caseWork: CaseWork;
  workspace?: WorkspaceEvidenceSource;
}): { service: ReturnType<typeof createArchiveService>; routeSpecs: RouteSpec[] } {
  const { caseWork } = deps;
  const service = createArchiveService({
    sources: {
      getCase: deps.cases.getCase,
      listCaseBundles: deps.bundles.listCaseBundles,
      originalPathFor: deps.evidence.pathFor,
      listBundleReplays: deps.replays.listBundleReplays,
      derivedDir: deps.derivedDir,
      listFindingsVersions: caseWork.findings.listVersions,
      getFindingsVersion: caseWork.reviews.getVersion,
      listFixes: caseWork.fixes.listFixes,
      readCaseChain: caseWork.audit.readCaseChain,
      jwks: caseWork.keys.jwks,
      workspace: deps.workspace,
    },
    keys: caseWork.keys,
    audit: caseWork.audit,
    notify: caseWork.notify,
    maxUnpackedBytes: deps.config.maxUnpackedBytes,
  });
  const routeSpecs = archiveRoutes(service, {
    incomingDir: deps.evidence.incoming,
    maxUploadBytes: deps.config.maxUploadBytes,
  });
  return { service, routeSpecs };
}

import { describeAtomicAudit } from '../support/atomic-audit-suite';
import { createTestApp } from '../support/test-app';

describeAtomicAudit('PGlite', () => createTestApp());

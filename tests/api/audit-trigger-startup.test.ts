import { auditTriggerStartupSuite } from '../support/audit-trigger-suite';
import { createTestDatabase } from '../support/test-database';

auditTriggerStartupSuite(() => createTestDatabase());

import type { Migration } from '../migration';
import { usersAndMail } from './2026-12-01-0001-users-and-mail';
import { catalogue } from './2026-12-01-0002-catalogue';
import { vendorPartListColumns } from './2026-12-01-0003-vendor-part-list-columns';
import { qualifications } from './2026-12-01-0004-qualifications';
import { qualificationRequests } from './2026-12-01-0005-qualification-requests';
import { demoSeedSteps } from './2026-12-04-0300-demo-seed-steps';
import { mailClaims } from './2026-12-04-0301-mail-claims';

/**
 * Every migration, oldest first. Append new ones at the end (file name
 * `YYYY-MM-DD-NNNN-what.ts`); never edit one that has landed.
 */
export const MIGRATIONS: Migration[] = [usersAndMail, catalogue, vendorPartListColumns, qualifications, qualificationRequests, demoSeedSteps, mailClaims];

import type { Migration } from '../migration';
import { usersAndMail } from './2026-12-01-0001-users-and-mail';
import { catalogue } from './2026-12-01-0002-catalogue';
import { vendorPartListColumns } from './2026-12-01-0003-vendor-part-list-columns';
import { qualifications } from './2026-12-01-0004-qualifications';
import { qualificationRequests } from './2026-12-01-0005-qualification-requests';
import { rateLimitWindows } from './2026-12-04-0200-rate-limit-windows';
import { measurementSets } from './2026-12-04-0700-measurement-sets';
import { sourceStandingFromDecisions } from './2026-12-04-0100-source-standing-from-decisions';
import { textGrams } from './2026-12-04-0400-text-grams';
import { vzToleranceColumn } from './2026-12-04-0401-vz-tolerance';
import { invitationRevoked } from './2026-12-04-0500-invitation-revoked';
import { decisionRecords } from './2026-12-04-0800-decision-records';
import { demoSeedSteps } from './2026-12-04-0300-demo-seed-steps';
import { mailClaims } from './2026-12-04-0301-mail-claims';
import { waivers } from './2026-12-04-0900-waivers';
import { qualificationPairState } from './2026-12-04-1000-qualification-pair-state';
import { usableSources } from './2026-12-04-1100-usable-sources';
import { vendorPartFilterIndex } from './2026-12-04-1101-vendor-part-filter-index';
import { extractionReaderVersion } from './2026-12-05-2030-extraction-reader-version';

/**
 * Every migration, oldest first. Append new ones at the end (file name
 * `YYYY-MM-DD-NNNN-what.ts`); never edit one that has landed.
 */
export const MIGRATIONS: Migration[] = [
  usersAndMail,
  catalogue,
  vendorPartListColumns,
  qualifications,
  qualificationRequests,
  rateLimitWindows,
  measurementSets,
  sourceStandingFromDecisions,
  textGrams,
  vzToleranceColumn,
  invitationRevoked,
  decisionRecords,
  demoSeedSteps,
  mailClaims,
  waivers,
  qualificationPairState,
  usableSources,
  vendorPartFilterIndex,
  extractionReaderVersion,
];

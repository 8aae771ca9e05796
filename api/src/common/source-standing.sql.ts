import { APPROVED_SOURCE_STATE, DECIDED_STATES, OPEN_STATES, USABLE_STATES, sqlStateList } from '@shuntwise/contracts';

/**
 * The source-standing rule of contracts/src/qualifications/source-standing.ts as SQL, for
 * the read models that must filter or sort in the database (Board, Sources, search,
 * catalogue lists). Every state list here is generated from the contracts' lists.
 */
export const DECIDED_SQL = sqlStateList(DECIDED_STATES);
export const USABLE_SQL = sqlStateList(USABLE_STATES);
export const OPEN_SQL = sqlStateList(OPEN_STATES);
export const APPROVED_SQL = sqlStateList([APPROVED_SOURCE_STATE]);

/** The state of the latest decided case of the source row `alias` (house_part_sources), or NULL. */
export function latestDecidedStateSql(alias = 's'): string {
  return `(SELECT d.state FROM qualifications d WHERE d.house_part_id = ${alias}.house_part_id AND d.vendor_part_id = ${alias}.vendor_part_id AND d.state IN ${DECIDED_SQL} ORDER BY d.revision DESC LIMIT 1)`;
}

/** The source's role as `sourceRoleOf` reads it: approved only by an approval decision that still stands. */
export function sourceRoleSql(alias = 's'): string {
  return `IF(COALESCE(${latestDecidedStateSql(alias)} IN ${APPROVED_SQL}, 0), 'approved', 'alternate')`;
}

/**
 * The usable sources (table usable_sources): one row per house-part source a designer may
 * design in, read from its cases by the standing rule of contracts (`sourceStanding`,
 * `isUsableStanding`) — never a rule of its own. It is a derived read index like
 * text_grams: written in the same transaction as every case write (QualificationsRepository)
 * and every new source link (HousePartsRepository); an unlinked source loses its row by the
 * foreign key (ON DELETE CASCADE). The designers' search joins it instead of deriving the
 * usable set from every case on each request.
 */
import { isUsableStanding, sourceStanding, type QualificationState } from '@shuntwise/contracts';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

interface CaseRow {
  id: number;
  housePartId: number;
  vendorPartId: number;
  revision: number;
  state: QualificationState;
}

interface SourceRow {
  id: number;
  housePartId: number;
  vendorPartId: number;
}

/** Whether a source with these cases is usable: the contracts' standing rule, nothing else. */
export function isUsableSource(cases: readonly Pick<CaseRow, 'id' | 'revision' | 'state'>[]): boolean {
  return isUsableStanding(sourceStanding(cases).standing);
}

/**
 * Re-reads one source's cases and writes whether it is usable, inside the caller's
 * transaction (the one that wrote the case or the link). The link and the cases are read
 * with shared locking reads: they see the latest commit, and a case another transaction is
 * writing makes this one wait for it, so the older answer is never left behind. Shared, not
 * exclusive, on the link: a decision holds the link shared from its catalogue read
 * (QualificationsRepository.catalogueBasis), and two decisions racing for one case would
 * otherwise deadlock on upgrading it instead of the loser getting its 409.
 */
export async function refreshUsableSource(sequelize: Sequelize, housePartId: number, vendorPartId: number, transaction: Transaction): Promise<void> {
  const [source] = await sequelize.query<SourceRow>(
    'SELECT id, house_part_id AS housePartId, vendor_part_id AS vendorPartId FROM house_part_sources WHERE house_part_id = ? AND vendor_part_id = ? LOCK IN SHARE MODE',
    { replacements: [housePartId, vendorPartId], type: QueryTypes.SELECT, transaction },
  );
  // No link, no standing: a case on an unlinked pair makes nothing usable (the row went with the link).
  if (!source) return;
  const cases = await sequelize.query<CaseRow>(
    'SELECT id, revision, state FROM qualifications WHERE house_part_id = ? AND vendor_part_id = ? LOCK IN SHARE MODE',
    { replacements: [housePartId, vendorPartId], type: QueryTypes.SELECT, transaction },
  );
  if (isUsableSource(cases)) {
    await sequelize.query('INSERT IGNORE INTO usable_sources (source_id, vendor_part_id, house_part_id) VALUES (?, ?, ?)', {
      replacements: [source.id, vendorPartId, housePartId],
      type: QueryTypes.INSERT,
      transaction,
    });
  } else {
    await sequelize.query('DELETE FROM usable_sources WHERE source_id = ?', { replacements: [source.id], type: QueryTypes.DELETE, transaction });
  }
}

/**
 * Rebuilds the whole table from the links and their cases (the migration's back-fill, bulk
 * loads that write cases with plain INSERTs). One pass over both tables, the rule applied per
 * source in JavaScript.
 */
export async function rebuildUsableSources(sequelize: Sequelize, transaction?: Transaction): Promise<number> {
  const sources = await sequelize.query<SourceRow>('SELECT id, house_part_id AS housePartId, vendor_part_id AS vendorPartId FROM house_part_sources', {
    type: QueryTypes.SELECT,
    transaction,
  });
  const cases = await sequelize.query<CaseRow>('SELECT id, house_part_id AS housePartId, vendor_part_id AS vendorPartId, revision, state FROM qualifications', {
    type: QueryTypes.SELECT,
    transaction,
  });
  const byPair = new Map<string, CaseRow[]>();
  for (const c of cases) {
    const key = `${c.housePartId}:${c.vendorPartId}`;
    const list = byPair.get(key);
    if (list) list.push(c);
    else byPair.set(key, [c]);
  }
  const usable = sources.filter((s) => isUsableSource(byPair.get(`${s.housePartId}:${s.vendorPartId}`) ?? []));
  await sequelize.query('DELETE FROM usable_sources', { type: QueryTypes.DELETE, transaction });
  for (let i = 0; i < usable.length; i += 2000) {
    const chunk = usable.slice(i, i + 2000);
    await sequelize.query(`INSERT INTO usable_sources (source_id, vendor_part_id, house_part_id) VALUES ${chunk.map(() => '(?, ?, ?)').join(', ')}`, {
      replacements: chunk.flatMap((s) => [s.id, s.vendorPartId, s.housePartId]),
      type: QueryTypes.INSERT,
      transaction,
    });
  }
  return usable.length;
}

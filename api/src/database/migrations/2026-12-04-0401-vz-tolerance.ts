import { vzTolerance, type RatingCardFields } from '@shuntwise/contracts';
import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The card's Zener-voltage tolerance as a list figure on vendor_parts, written with the card
 * by the one rule in contracts (printed tolerance, else the window ends less their print
 * rounding): the search's "tolerance or better" filter is then an index range instead of
 * arithmetic on the card's JSON, and a ±5 % part printed 4.85 / 5.36 V is found as ±5 %.
 */
export const vzToleranceColumn: Migration = {
  name: '2026-12-04-0401-vz-tolerance',
  async up({ queryInterface: q, sequelize }) {
    await q.addColumn('vendor_parts', 'vz_tolerance', { type: DataTypes.DOUBLE, allowNull: true });
    await q.addIndex('vendor_parts', ['vz_tolerance'], { name: 'vendor_parts_vz_tolerance' });
    const cards = await sequelize.query<{ id: number; fields: RatingCardFields | string }>('SELECT vendor_part_id AS id, fields FROM rating_cards', {
      type: QueryTypes.SELECT,
    });
    for (const card of cards) {
      const fields = typeof card.fields === 'string' ? (JSON.parse(card.fields) as RatingCardFields) : card.fields;
      const tolerance = vzTolerance(fields);
      if (tolerance !== null)
        await sequelize.query('UPDATE vendor_parts SET vz_tolerance = ? WHERE id = ?', { replacements: [tolerance, card.id], type: QueryTypes.UPDATE });
    }
  },
  async down({ sequelize }) {
    await sequelize.query('ALTER TABLE vendor_parts DROP INDEX vendor_parts_vz_tolerance, DROP COLUMN vz_tolerance', { type: QueryTypes.BULKUPDATE });
  },
};

import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Vendor-part lists read one table. At 100 000 parts, sorting by the manufacturer's name
 * or a card figure across a join made MariaDB sort every row (a temporary table and a
 * filesort, about 0.25 s a page); with the manufacturer's name and the card's list figures
 * on vendor_parts, every sort and filter of the table is an index range. The copies are
 * written in the same transaction as the manufacturer link and the card.
 */
export const vendorPartListColumns: Migration = {
  name: '2026-12-01-0003-vendor-part-list-columns',
  async up({ queryInterface: q, sequelize }) {
    await q.addColumn('vendor_parts', 'manufacturer_name', { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' });
    await q.addColumn('vendor_parts', 'card_version', { type: DataTypes.INTEGER, allowNull: true });
    await q.addColumn('vendor_parts', 'vz_nom', { type: DataTypes.DOUBLE, allowNull: true });
    await q.addColumn('vendor_parts', 'izt', { type: DataTypes.DOUBLE, allowNull: true });
    await q.addColumn('vendor_parts', 'pd_max', { type: DataTypes.DOUBLE, allowNull: true });
    await sequelize.query('UPDATE vendor_parts vp JOIN manufacturers m ON m.id = vp.manufacturer_id SET vp.manufacturer_name = m.name', {
      type: QueryTypes.UPDATE,
    });
    await sequelize.query(
      'UPDATE vendor_parts vp JOIN rating_cards rc ON rc.vendor_part_id = vp.id SET vp.card_version = rc.version, vp.vz_nom = rc.vz_nom, vp.izt = rc.izt, vp.pd_max = rc.pd_max',
      { type: QueryTypes.UPDATE },
    );
    await q.addIndex('vendor_parts', ['manufacturer_name', 'mpn'], { name: 'vendor_parts_manufacturer_name_mpn' });
    await q.addIndex('vendor_parts', ['vz_nom'], { name: 'vendor_parts_vz_nom' });
    await q.addIndex('vendor_parts', ['izt'], { name: 'vendor_parts_izt' });
    await q.addIndex('vendor_parts', ['pd_max'], { name: 'vendor_parts_pd_max' });
    await q.addIndex('vendor_parts', ['card_version'], { name: 'vendor_parts_card_version' });
    // One home for the list figures: the card row keeps only the card. (Plain DDL: the query
    // interface's removeColumn runs an untyped raw query, which the mariadb driver refuses.)
    await sequelize.query(
      'ALTER TABLE rating_cards DROP INDEX rating_cards_vz_nom, DROP INDEX rating_cards_izt, DROP INDEX rating_cards_pd_max, DROP COLUMN vz_nom, DROP COLUMN izt, DROP COLUMN pd_max',
      { type: QueryTypes.BULKUPDATE },
    );
  },
  async down({ queryInterface: q, sequelize }) {
    await q.addColumn('rating_cards', 'vz_nom', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 });
    await q.addColumn('rating_cards', 'izt', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 });
    await q.addColumn('rating_cards', 'pd_max', { type: DataTypes.DOUBLE, allowNull: true });
    await sequelize.query(
      'UPDATE rating_cards rc JOIN vendor_parts vp ON vp.id = rc.vendor_part_id SET rc.vz_nom = vp.vz_nom, rc.izt = vp.izt, rc.pd_max = vp.pd_max',
      {
        type: QueryTypes.UPDATE,
      },
    );
    for (const column of ['vz_nom', 'izt', 'pd_max']) await q.addIndex('rating_cards', [column]);
    await sequelize.query(
      `ALTER TABLE vendor_parts ${['manufacturer_name_mpn', 'vz_nom', 'izt', 'pd_max', 'card_version'].map((i) => `DROP INDEX vendor_parts_${i}`).join(', ')},
       ${['manufacturer_name', 'card_version', 'vz_nom', 'izt', 'pd_max'].map((c) => `DROP COLUMN ${c}`).join(', ')}`,
      { type: QueryTypes.BULKUPDATE },
    );
  },
};

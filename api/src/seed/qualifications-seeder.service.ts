import { Injectable, Logger } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import { CARD_FIELDS, ratingCardFieldsInputSchema, type QualificationAction, type RatingCardFields, type RatingCardFieldsInput } from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { RatingCardsService } from '../vendor-parts/rating-cards.service';
import { HousePartBuyersRepository } from '../house-part-buyers/house-part-buyers.repository';
import { QualificationsRepository } from '../qualifications/qualifications.repository';
import { QualificationsService, type ActionBody } from '../qualifications/qualifications.service';
import { DecisionRecordsService } from '../qualifications/records/decision-records.service';

/** Card versions the qualification seed adds to the demo catalogue (the re-check story's erratum). */
export const QUALIFICATION_SEED_CARD_REVISIONS = 1;

const PREPARER = 'engineer@demo.test';
const REVIEWER = 'reviewer@demo.test';
const BUYER = 'buyer@demo.test';

type Who = 'preparer' | 'reviewer';
interface Step {
  action: QualificationAction | 'comment';
  by: Who;
  body?: ActionBody & { text?: string };
}
interface DemoCase {
  partNumber: string;
  /** Manufacturer part number of the source (unique in the demo catalogue). */
  mpn: string;
  summary: string;
  steps: Step[];
  /** How long ago the case was worked on, so the Board shows ages. */
  daysAgo: number;
  /** After the steps, a vendor correction to the card (a real new card version) flags the decided case. */
  erratum?: { field: 'zzk'; value: number; printed: string; note: string };
}

const review: Step = { action: 'submit', by: 'preparer', body: {} };

/** The invented demo catalogue (plain CommonJS), loaded when the demo is seeded. */
function demoCatalogue(): ReturnType<typeof import('@shuntwise/test-fixtures').loadDemoCatalogue> {
  return (require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures')).loadDemoCatalogue();
}

/** How long ago the demo's approved sources were approved (before every other case). */
const APPROVED_DAYS_AGO = 120;

/**
 * The demo's qualification cases: one in every state, prepared by the demo engineer and
 * decided by the second engineer, with comments and a full audit trail, plus one cleared
 * case that a vendor correction to its card marks for re-check. Every case goes through
 * the same service the API uses (its audit entries and its mail included); the demo buyer
 * follows every house part. Idempotent: a house part and source that already has a case
 * is left alone.
 */
export const DEMO_CASES: readonly DemoCase[] = [
  {
    partNumber: 'OHI-ZD-1047',
    mpn: 'QHZ4V7A',
    summary: 'Second source for the sensor-supply clamp; the approved part is on allocation.',
    daysAgo: 41,
    steps: [
      review,
      { action: 'comment', by: 'reviewer', body: { text: 'Checked every figure against page 2 of the datasheet; nothing to add.' } },
      { action: 'clear', by: 'reviewer', body: { note: 'Equivalent on every check.' } },
    ],
  },
  {
    partNumber: 'OHI-ZD-1056',
    mpn: 'QHZ5V6A',
    summary: 'Lower-cost alternate proposed by purchasing for the loop-driver reference.',
    daysAgo: 33,
    steps: [review, { action: 'clear', by: 'reviewer', body: {} }],
  },
  {
    partNumber: 'OHI-ZD-2110',
    mpn: 'TPZ15-11',
    summary: 'Alternate for the valve-driver clamp; leakage sits right at the spec limit.',
    daysAgo: 26,
    steps: [
      review,
      { action: 'comment', by: 'reviewer', body: { text: 'Leakage is on the limit with no margin. I can clear it only with an incoming check.' } },
      { action: 'comment', by: 'preparer', body: { text: 'Agreed; quality will sample five pieces per lot.' } },
      {
        action: 'clear-with-conditions',
        by: 'reviewer',
        body: { conditions: 'Incoming inspection measures reverse leakage at 7.7 V on five pieces per lot; reject the lot above 1 µA.' },
      },
    ],
  },
  {
    partNumber: 'OHI-ZD-2082',
    mpn: 'TPZ15-8V2',
    summary: 'Alternate for the display-board shunt regulator.',
    daysAgo: 19,
    steps: [review, { action: 'reject', by: 'reviewer', body: { reason: 'Reverse leakage is 25 % above the spec limit at 5.7 V.' } }],
  },
  {
    partNumber: 'OHI-ZD-1240',
    mpn: 'QHZ24AF',
    summary: 'Alternate for the 24 V input protection.',
    daysAgo: 60,
    steps: [
      review,
      { action: 'clear', by: 'reviewer', body: {} },
      { action: 'revoke', by: 'reviewer', body: { reason: 'The vendor announced a move of assembly to a new site; re-qualify on the first lots from there.' } },
    ],
  },
  {
    partNumber: 'OHI-ZD-1051',
    mpn: 'NMZ-05V1',
    summary: 'Alternate for the 5 V rail clamp.',
    daysAgo: 14,
    steps: [
      {
        action: 'comment',
        by: 'preparer',
        body: { text: 'The datasheet gives leakage at 1 V only; the spec asks for 2 V. Asked the vendor for the 2 V figure.' },
      },
      { action: 'withdraw', by: 'preparer', body: { reason: 'Waiting for the vendor’s leakage figure at 2 V; will reopen when it arrives.' } },
    ],
  },
  {
    partNumber: 'OHI-ZD-1068',
    mpn: 'QHZ6V8A',
    summary: 'Alternate for the MOSFET gate clamp.',
    daysAgo: 9,
    steps: [{ action: 'submit', by: 'preparer', body: { note: 'All checks pass; please review.' } }],
  },
  {
    partNumber: 'OHI-ZD-1082',
    mpn: 'QHZ8V2AF',
    summary: 'Started on the auxiliary rail limiter; still collecting the package drawing.',
    daysAgo: 2,
    steps: [],
  },
  {
    partNumber: 'OHI-ZD-1120',
    mpn: 'BRZ05-12',
    summary: 'Alternate for the relay-driver clamp.',
    daysAgo: 48,
    steps: [review, { action: 'clear', by: 'reviewer', body: {} }],
    erratum: { field: 'zzk', value: 300, printed: '300 Ω', note: 'Vendor erratum: zzk at 0.25 mA is 300 Ω, not 270 Ω' },
  },
];

@Injectable()
export class QualificationsSeeder {
  private readonly logger = new Logger('Seed');

  constructor(
    private readonly cases: QualificationsRepository,
    private readonly buyers: HousePartBuyersRepository,
    private readonly service: QualificationsService,
    private readonly cards: RatingCardsService,
    private readonly records: DecisionRecordsService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  async run(): Promise<{ created: number; seconds: number }> {
    // Dozens of decisions at start-up: their PDF records are drawn on first read instead (records/decision-records.service.ts).
    return this.records.deferStoring(() => this.seedAll());
  }

  private async seedAll(): Promise<{ created: number; seconds: number }> {
    const started = performance.now();
    const [preparer, reviewer, buyer] = await Promise.all([PREPARER, REVIEWER, BUYER].map((e) => this.user(e)));
    const who = { preparer, reviewer };
    let created = 0;

    // The approved sources first, before any buyer follows the parts: the demo's history starts with them.
    created += await this.approveReferenceSources(preparer, reviewer);

    // The demo buyer follows every house part, so decisions reach the demo outbox.
    const parts = await this.sequelize.query<{ id: number }>('SELECT id FROM house_parts ORDER BY id', { type: QueryTypes.SELECT });
    for (const { id } of parts) {
      if (await this.buyers.find(id, buyer.id)) continue;
      await this.buyers.add({ housePartId: id, userId: buyer.id, addedById: preparer.id });
      created++;
    }

    for (const demo of DEMO_CASES) {
      const pair = await this.pair(demo.partNumber, demo.mpn);
      const [existing] = await this.sequelize.query<{ id: number }>('SELECT id FROM qualifications WHERE house_part_id = ? AND vendor_part_id = ? LIMIT 1', {
        replacements: [pair.housePartId, pair.vendorPartId],
        type: QueryTypes.SELECT,
      });
      if (existing) continue;
      const opened = { id: await this.service.open({ ...pair, summary: demo.summary }, preparer) };
      for (const step of demo.steps) {
        const user = who[step.by];
        if (step.action === 'comment') await this.service.comment(opened.id, step.body!.text!, user);
        else await this.service.apply(opened.id, step.action, step.action === 'submit' ? { reviewerId: reviewer.id, ...step.body } : (step.body ?? {}), user);
      }
      await this.backdate(opened.id, demo.daysAgo);
      if (demo.erratum) await this.correctCard(pair.vendorPartId, demo.erratum, preparer);
      created++;
    }
    const seconds = (performance.now() - started) / 1000;
    this.logger.log(`demo qualifications: ${created} records added in ${seconds.toFixed(2)} s`);
    return { created, seconds };
  }

  /**
   * Each approved source of the demo catalogue becomes one the only way there is: a case the
   * demo engineer prepares and sends for review, and the second engineer approves (audit
   * trail included). A pair that already has a case is left alone.
   */
  private async approveReferenceSources(preparer: AuthUser, reviewer: AuthUser): Promise<number> {
    let created = 0;
    for (const housePart of demoCatalogue().houseParts) {
      for (const source of housePart.sources.filter((s) => s.role === 'approved')) {
        const pair = await this.pair(housePart.partNumber, source.mpn);
        const [existing] = await this.sequelize.query<{ id: number }>('SELECT id FROM qualifications WHERE house_part_id = ? AND vendor_part_id = ? LIMIT 1', {
          replacements: [pair.housePartId, pair.vendorPartId],
          type: QueryTypes.SELECT,
        });
        if (existing) continue;
        const id = await this.service.open(
          { ...pair, summary: `Approved source of record for ${housePart.partNumber}: the part its spec was written from.` },
          preparer,
        );
        await this.service.apply(id, 'submit', { reviewerId: reviewer.id }, preparer);
        await this.service.apply(
          id,
          'approve',
          { note: 'Reference part the spec was written from; any margin below is the spec drawn tight around it.' },
          reviewer,
        );
        await this.backdate(id, APPROVED_DAYS_AGO);
        created++;
      }
    }
    return created;
  }

  private async user(email: string): Promise<AuthUser> {
    const [row] = await this.sequelize.query<AuthUser>('SELECT id, email, name, role FROM users WHERE email = ?', {
      replacements: [email],
      type: QueryTypes.SELECT,
    });
    if (!row) throw new Error(`the demo qualifications need the demo account ${email}: seed the users first`);
    return row;
  }

  private async pair(partNumber: string, mpn: string): Promise<{ housePartId: number; vendorPartId: number }> {
    const [row] = await this.sequelize.query<{ housePartId: number; vendorPartId: number }>(
      `SELECT s.house_part_id AS housePartId, s.vendor_part_id AS vendorPartId FROM house_part_sources s
       JOIN house_parts h ON h.id = s.house_part_id JOIN vendor_parts vp ON vp.id = s.vendor_part_id
       WHERE h.part_number = ? AND vp.mpn = ?`,
      { replacements: [partNumber, mpn], type: QueryTypes.SELECT },
    );
    if (!row) throw new Error(`demo qualifications: ${mpn} is not a source of ${partNumber} in the demo catalogue`);
    return row;
  }

  /** A vendor's correction entered as a new card version through the catalogue's own write path (its event flags the case). */
  private async correctCard(vendorPartId: number, erratum: NonNullable<DemoCase['erratum']>, user: AuthUser): Promise<void> {
    const card = await this.cards.card(vendorPartId);
    const fields = {
      ...toInput(card.fields),
      [erratum.field]: { value: erratum.value, printed: erratum.printed, provenance: { source: 'entered', text: erratum.note }, confirmed: true },
    };
    await this.sequelize.transaction((transaction) =>
      this.cards.write(vendorPartId, { baseVersion: card.version, fields: ratingCardFieldsInputSchema.parse(fields), note: erratum.note }, user, transaction),
    );
  }

  /** Moves a case's timestamps (and its trail's and comments') into the past, keeping their order. */
  private async backdate(id: number, days: number): Promise<void> {
    const shift = (column: string) => `${column} = IF(${column} IS NULL, NULL, DATE_SUB(${column}, INTERVAL ? DAY))`;
    await this.sequelize.query(
      `UPDATE qualifications SET ${['created_at', 'updated_at', 'submitted_at', 'decided_at', 'revoked_at'].map(shift).join(', ')} WHERE id = ?`,
      { replacements: [days, days, days, days, days, id], type: QueryTypes.UPDATE },
    );
    for (const table of ['qualification_events', 'qualification_comments']) {
      await this.sequelize.query(`UPDATE ${table} SET created_at = DATE_SUB(created_at, INTERVAL ? DAY) WHERE qualification_id = ?`, {
        replacements: [days, id],
        type: QueryTypes.UPDATE,
      });
    }
  }
}

/** A stored card back in the shape the card editor sends, every value kept as it is (confirmed). */
function toInput(fields: RatingCardFields): RatingCardFieldsInput {
  const out: Record<string, unknown> = {};
  for (const f of CARD_FIELDS) {
    const v = fields[f];
    if (!v) continue;
    const provenance = { source: v.provenance.source, datasheetId: v.provenance.datasheetId, page: v.provenance.page, text: v.provenance.text };
    out[f] = { value: v.value, printed: v.printed, provenance, confirmed: v.provenance.confirmedBy !== null, ...('unit' in v ? { unit: v.unit } : {}) };
  }
  return out as RatingCardFieldsInput;
}

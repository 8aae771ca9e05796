import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Injectable, Logger } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import {
  ratingCardFieldsInputSchema,
  specSchema,
  type ExtractionResult,
  type HousePartStatus,
  type RatingCardFieldsInput,
  type SpecInput,
} from '@shuntwise/contracts';
import type { CatalogueCardField, CatalogueHousePart, CatalogueVendorPart, DemoCatalogue } from '@shuntwise/test-fixtures';
import { Sequelize } from 'sequelize-typescript';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { DatasheetsService } from '../datasheets/datasheets.service';
import { HousePartsRepository } from '../house-parts/house-parts.repository';
import { HousePartsService } from '../house-parts/house-parts.service';
import { UsersRepository } from '../users/users.repository';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';

/** The invented demo catalogue (@shuntwise/test-fixtures): plain CommonJS, loaded when the demo is seeded. */
function loadFixtures(): { catalogue: DemoCatalogue; datasheetDir: string } {
  const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');
  return { catalogue: fixtures.loadDemoCatalogue(), datasheetDir: fixtures.paths.datasheets };
}

export const DEMO_CATALOGUE_ENGINEER = 'engineer@demo.test';

/**
 * Loads the demo catalogue through the same services the API uses: the datasheets are
 * uploaded (real objects, real extraction), each series becomes vendor parts with cards
 * whose values point at their datasheet page, house parts get their spec and sources
 * (linked as candidates: the approved ones are approved by decisions in QualificationsSeeder).
 * Idempotent by natural keys (sha256, manufacturer + mpn, part number): a second run adds nothing.
 */
@Injectable()
export class CatalogueSeeder {
  private readonly logger = new Logger('Seed');

  constructor(
    private readonly users: UsersRepository,
    private readonly datasheets: DatasheetsService,
    private readonly vendorParts: VendorPartsRepository,
    private readonly houseParts: HousePartsRepository,
    private readonly housePartsService: HousePartsService,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  async run(): Promise<{ created: number; seconds: number }> {
    const started = performance.now();
    const { catalogue, datasheetDir } = loadFixtures();
    const engineer = await this.users.findByEmail(DEMO_CATALOGUE_ENGINEER);
    if (!engineer) throw new Error(`the demo catalogue needs the demo account ${DEMO_CATALOGUE_ENGINEER}: seed the users first`);
    const user: AuthUser = { id: engineer.id, email: engineer.email, name: engineer.name, role: engineer.role };
    const vendorName = new Map(catalogue.vendors.map((v) => [v.code, v.name]));
    let created = 0;

    // Datasheets first: the cards' provenance points at them.
    const sheets = new Map<string, { id: number; extraction: ExtractionResult }>();
    for (const sheet of catalogue.datasheets) {
      const buffer = readFileSync(join(datasheetDir, sheet.file));
      const uploaded = await this.datasheets.upload({ buffer, originalName: sheet.file }, { revision: 'A' }, user);
      if (!uploaded.existing) created++;
      sheets.set(sheet.file, { id: uploaded.id, extraction: await this.datasheets.extraction(uploaded.id) });
    }

    // Each series in one transaction, through the same path as a reviewed series datasheet.
    const bySheet = new Map<string, CatalogueVendorPart[]>();
    for (const part of catalogue.vendorParts) bySheet.set(part.datasheet.file, [...(bySheet.get(part.datasheet.file) ?? []), part]);
    for (const [file, parts] of bySheet) {
      const sheet = sheets.get(file)!;
      const byManufacturer = new Map<string, CatalogueVendorPart[]>();
      for (const part of parts) {
        const manufacturer = vendorName.get(part.vendor)!;
        const existing = (await this.vendorParts.findByNames([{ manufacturer, mpn: part.mpn }]))[0];
        if (existing?.cardVersion != null) continue;
        byManufacturer.set(manufacturer, [...(byManufacturer.get(manufacturer) ?? []), part]);
      }
      for (const [manufacturer, todo] of byManufacturer) {
        const variants = todo.map((part) => ({
          mpn: part.mpn,
          package: part.package,
          lifecycleNote: part.lifecycleNote ? `${part.lifecycle}: ${part.lifecycleNote}` : part.lifecycle,
          fields: ratingCardFieldsInputSchema.parse(cardFields(part, sheet.id, sheet.extraction)),
        }));
        const result = await this.datasheets.createVariants(sheet.id, { manufacturer, variants }, user);
        created += result.vendorParts.length;
      }
    }

    for (const housePart of catalogue.houseParts) created += await this.seedHousePart(housePart, vendorName, user);

    const seconds = (performance.now() - started) / 1000;
    this.logger.log(`demo catalogue: ${created} records added in ${seconds.toFixed(2)} s`);
    return { created, seconds };
  }

  private async seedHousePart(item: CatalogueHousePart, vendorName: Map<string, string>, user: AuthUser): Promise<number> {
    let created = 0;
    let part = await this.houseParts.findByPartNumber(item.partNumber);
    if (!part) {
      part = await this.houseParts.create({
        partNumber: item.partNumber,
        description: item.description,
        status: item.status as HousePartStatus,
        createdById: user.id,
      });
      created++;
    }
    if (part.specVersion == null) {
      const { version: _version, marginalBand, ...rest } = item.spec;
      const spec: SpecInput = { ...rest, marginalBandPercent: Number((marginalBand * 100).toPrecision(12)) };
      await this.housePartsService.putSpec(part.id, { baseVersion: 0, spec: specSchema.parse(spec), note: 'demo catalogue' }, user);
      created++;
    }
    for (const source of item.sources) {
      const [vendorPart] = await this.vendorParts.findByNames([{ manufacturer: vendorName.get(source.vendor)!, mpn: source.mpn }]);
      if (!vendorPart) throw new Error(`demo catalogue: ${item.partNumber} names a source ${source.vendor} ${source.mpn} that is not in the catalogue`);
      if (await this.houseParts.findSource(part.id, vendorPart.id)) continue;
      // Linked as a candidate; the approved source becomes one through its case (QualificationsSeeder).
      await this.houseParts.createSource({ housePartId: part.id, vendorPartId: vendorPart.id, note: null, addedById: user.id });
      created++;
    }
    return created;
  }
}

/**
 * The card of a catalogue part: every value marked extracted from its datasheet page, with
 * the text the extraction read it from when the extraction found the same value there.
 */
function cardFields(part: CatalogueVendorPart, datasheetId: number, extraction: ExtractionResult): RatingCardFieldsInput {
  const found = extraction.variants.find((v) => v.mpn === part.mpn)?.fields ?? {};
  const fields: Record<string, unknown> = {};
  for (const [field, value] of Object.entries(part.ratingCard.fields) as Array<[keyof typeof found, CatalogueCardField]>) {
    const hit = found[field];
    const agrees = hit && hit.page === value.page && Math.abs(hit.si - value.value) <= 1e-9 * Math.max(1, Math.abs(value.value));
    const provenance = { source: 'extracted' as const, datasheetId, page: value.page, text: agrees ? hit.text.slice(0, 500) : value.printed };
    fields[field] =
      field === 'tc'
        ? { value: value.valueInUnit, unit: value.unit, printed: value.printed, provenance }
        : { value: value.value, printed: value.printed, provenance };
  }
  // The power rating's reference ambient is stated with the rating, not extracted as a field of its own.
  fields.pdRefC = { value: part.ratingCard.pdRefC, printed: `${part.ratingCard.pdRefC} °C`, provenance: { source: 'entered' } };
  return fields as RatingCardFieldsInput;
}

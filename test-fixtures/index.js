'use strict';
// Paths and loaders for the invented demo data. Plain CommonJS so that the compiled api
// (seed, tests) and any tool can require it without a build step.
const fs = require('node:fs');
const path = require('node:path');

const root = __dirname;
const paths = {
  root,
  datasheets: path.join(root, 'datasheets'),
  badUploads: path.join(root, 'bad-uploads'),
  catalogue: path.join(root, 'catalogue'),
  scanned: path.join(root, 'scanned'),
  demoCatalogue: path.join(root, 'catalogue', 'demo-catalogue.json'),
  measurements: path.join(root, 'measurements'),
};

const badUploads = {
  notPdf: path.join(paths.badUploads, 'not-a-pdf.pdf'),
  empty: path.join(paths.badUploads, 'empty.pdf'),
  truncated: path.join(paths.badUploads, 'truncated.pdf'),
  corrupt: path.join(paths.badUploads, 'corrupt.pdf'),
  encrypted: path.join(paths.badUploads, 'encrypted.pdf'),
  scanned: path.join(paths.badUploads, 'scanned.pdf'),
};

function readJson(file) {
  return JSON.parse(fs.readFileSync(file, 'utf8'));
}

function loadDemoCatalogue() {
  return readJson(paths.demoCatalogue);
}

function listDatasheetFixtures() {
  return fs
    .readdirSync(paths.datasheets)
    .filter((f) => f.endsWith('.pdf'))
    .sort()
    .map((f) => {
      const pdfPath = path.join(paths.datasheets, f);
      const answersPath = pdfPath.replace(/\.pdf$/, '.answers.json');
      return { name: f, pdfPath, answersPath, answers: readJson(answersPath) };
    });
}

/** The invented bench measurements of demo parts, with the file's path beside each entry. */
function listMeasurementFixtures() {
  return readJson(path.join(paths.measurements, 'measurements.json')).map((m) => ({ ...m, csvPath: path.join(paths.measurements, m.file) }));
}

/**
 * Random-layout datasheets (scripts/lib/random-layout, TypeScript): loaded through tsx's
 * require hook on first use, so that plain Node, jest and tsx can all call it without a build.
 */
let randomLayout;
function loadRandomLayout() {
  if (!randomLayout) {
    // Under jest the test runner's own TypeScript transform loads it; elsewhere tsx does.
    randomLayout =
      process.env.JEST_WORKER_ID !== undefined
        ? require('./scripts/lib/random-layout/index.ts')
        : require('tsx/cjs/api').require('./scripts/lib/random-layout/index.ts', __filename);
  }
  return randomLayout;
}

function generateRandomDatasheet(seed, overrides, options) {
  return loadRandomLayout().generateRandomDatasheet(seed, overrides, options);
}

function layoutChoiceLabels(choices) {
  return loadRandomLayout().choiceLabels(choices);
}

/** Scanned copies (image-only pages) of some datasheets; the original's answer key holds page for page. */
function listScannedFixtures() {
  const originals = listDatasheetFixtures();
  return fs
    .readdirSync(paths.scanned)
    .filter((f) => f.endsWith('.scanned.pdf'))
    .sort()
    .map((f) => {
      const original = originals.find((o) => o.name === f.replace(/\.scanned\.pdf$/, '.pdf'));
      return { name: f, pdfPath: path.join(paths.scanned, f), original };
    });
}

module.exports = {
  paths,
  badUploads,
  loadDemoCatalogue,
  listDatasheetFixtures,
  listScannedFixtures,
  listMeasurementFixtures,
  generateRandomDatasheet,
  layoutChoiceLabels,
};

import { vendorPartModelSchema, type VendorPartModel } from '@shuntwise/contracts';
import { apiRequest, saveBlob } from '@/lib/api-client';

export function getPartModel(vendorPartId: number): Promise<VendorPartModel> {
  return apiRequest(`/vendor-parts/${vendorPartId}/model`, { schema: vendorPartModelSchema });
}

/** The .model lines as a SPICE library file: the caution and warnings as comments, then nominal and tolerance ends. */
export function modelLibraryText(mpn: string, model: VendorPartModel): string {
  const comment = (text: string) => text.split('\n').map((line) => `* ${line}`);
  return [
    `* ${mpn}: SPICE diode models fitted to rating card version ${model.cardVersion}`,
    ...comment(model.caution),
    ...model.warnings.flatMap(comment),
    model.lines.nom,
    ...(model.lines.min ? [model.lines.min] : []),
    ...(model.lines.max ? [model.lines.max] : []),
    '',
  ].join('\n');
}

/** Fetches the part's .model and saves it as `<name>.lib`; returns the file name. */
export async function downloadPartModel(vendorPartId: number, mpn: string): Promise<string> {
  const model = await getPartModel(vendorPartId);
  const name = `${model.name}.lib`;
  saveBlob(new Blob([modelLibraryText(mpn, model)], { type: 'text/plain;charset=utf-8' }), name);
  return name;
}

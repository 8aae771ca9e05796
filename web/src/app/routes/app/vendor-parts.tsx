import { ScreenNotBuilt } from '@/components/screen-not-built';

// TODO: replaced by the Vendor parts screen when its issue is built.
export function VendorPartsRoute() {
  return <ScreenNotBuilt title="Vendor parts" purpose="Manufacturer parts with their datasheets and rating cards." />;
}

import { impurityCurves, type ImpurityCurve } from './black-carbon';
import { ostremFamily, type OstremFamily } from './ostrem';
import { warmingResponse, type WarmingResponse } from './warming-response';
import { selectedBand, type BandSite } from './site';

export interface SurfaceResponseResult {
  ostrem: OstremFamily;
  warming: WarmingResponse;
  impurity: ImpurityCurve[];
}

/** Everything the surface-response panels show for one band and period. */
export function surfaceResponse(site: BandSite): SurfaceResponseResult {
  const band = selectedBand(site);
  const ostrem = ostremFamily(site);
  return {
    ostrem,
    warming: warmingResponse(ostrem, band.debrisFraction > 0 ? band.debrisThicknessM : 0),
    impurity: impurityCurves(site),
  };
}

import type { AppConfig } from '../../config';
import type { BandService } from '../catchments/band-service';
import type { ThreadBudget } from '../thread-budget';
import { Derivations } from './derivation-service';
import { GeodataPool } from './geodata-pool';
import { GeodataStore } from './geodata-store';
import { CatchmentMaps } from './map-service';
import { RemoteSensingObservations } from './observation-service';
import { GeodataUploads } from './upload-service';

export interface GeodataServices {
  geodata: {
    store: GeodataStore;
    pool: GeodataPool;
    uploads: GeodataUploads;
    derivations: Derivations;
    maps: CatchmentMaps;
    observations: RemoteSensingObservations;
  };
}

/** Geodata of catchments: uploads kept in the geodata store, bands derived on the geodata pool, maps and remote-sensing observations. */
export function createGeodataServices(deps: { config: AppConfig; bands: BandService; threads: ThreadBudget }): GeodataServices {
  const store = new GeodataStore(deps.config.geodata.dir);
  const pool = new GeodataPool(deps.threads);
  const uploads = new GeodataUploads(store, pool, deps.bands);
  const derivations = new Derivations(store, pool, uploads, deps.bands);
  return { geodata: { store, pool, uploads, derivations, maps: new CatchmentMaps(store, derivations, deps.bands), observations: new RemoteSensingObservations() } };
}

import {
  catchmentMapSchema, derivationListReplySchema, derivationReplySchema, geodataUploadReplySchema, geodataUploadsReplySchema, observationsReplySchema,
  type DeriveRequest, type GeodataLayer,
} from '@shared/schemas/geodata';
import { bandTableVersionsReplySchema } from '@shared/schemas/catchment-bands';
import { api } from './http';

const base = (id: number) => `/api/catchments/${id}/geodata`;

/** Typed calls for a catchment's geodata: uploads, derived bands, the map and remote-sensing observations. */
export const geodataApi = {
  uploads: (id: number) => api.get(`${base(id)}/uploads`, geodataUploadsReplySchema),
  upload: (id: number, layer: GeodataLayer, files: { file: File; after?: File }, fields: Record<string, string> = {}) => {
    const form = new FormData();
    for (const [key, value] of Object.entries(fields)) if (value !== '') form.append(key, value);
    form.append('file', files.file);
    if (files.after) form.append('after', files.after);
    return api.post(`${base(id)}/uploads/${layer}`, undefined, { form, schema: geodataUploadReplySchema, quiet: true });
  },
  removeUpload: (id: number, uploadId: number) => api.delete(`${base(id)}/uploads/${uploadId}`),
  derive: (id: number, request: DeriveRequest) => api.post(`${base(id)}/derivations`, request, { schema: derivationReplySchema, quiet: true }),
  derivations: (id: number) => api.get(`${base(id)}/derivations`, derivationListReplySchema),
  derivation: (id: number, derivationId: number) => api.get(`${base(id)}/derivations/${derivationId}`, derivationReplySchema),
  apply: (id: number, derivationId: number) => api.post(`${base(id)}/derivations/${derivationId}/apply`, undefined, { schema: derivationReplySchema, quiet: true }),
  hillshadeUrl: (id: number, derivationId: number) => `${base(id)}/derivations/${derivationId}/hillshade.png`,
  map: (id: number, options: { run?: number } = {}) => api.get(`${base(id)}/map${options.run ? `?run=${options.run}` : ''}`, catchmentMapSchema),
  observations: (id: number) => api.get(`${base(id)}/observations`, observationsReplySchema),
  bandVersions: (id: number) => api.get(`/api/catchments/${id}/bands/versions`, bandTableVersionsReplySchema),
};

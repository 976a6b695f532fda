import { datasetReplySchema } from '@shared/schemas/datasets';
import { gradientsReplySchema } from '@shared/schemas/gradients';
import { stationComparisonSchema, stationListSchema, stationReplySchema, type StationForm } from '@shared/schemas/stations';
import { waterSettingsReplySchema, type GradientSettings, type WaterSettingsInput } from '@shared/schemas/water-settings';
import { api } from './http';

const base = (id: number) => `/api/catchments/${id}`;

/** Typed calls for a catchment's stations, its water settings and the gradients fitted from its stations. */
export const waterApi = {
  stations: (id: number) => api.get(`${base(id)}/stations`, stationListSchema),
  createStation: (id: number, form: StationForm) => api.post(`${base(id)}/stations`, form, { schema: stationReplySchema, quiet: true }),
  updateStation: (id: number, stationId: number, form: StationForm) => api.put(`${base(id)}/stations/${stationId}`, form, { schema: stationReplySchema, quiet: true }),
  removeStation: (id: number, stationId: number) => api.delete(`${base(id)}/stations/${stationId}`),
  compare: (id: number, first: number, second: number) => api.get(`${base(id)}/stations/compare?first=${first}&second=${second}`, stationComparisonSchema, { quiet: true }),
  assignStation: (id: number, datasetId: number, stationId: number | null) => api.put(`${base(id)}/datasets/${datasetId}/station`, { stationId }, { schema: datasetReplySchema }),

  settings: (id: number) => api.get(`${base(id)}/water`, waterSettingsReplySchema),
  saveSettings: (id: number, settings: WaterSettingsInput) => api.put(`${base(id)}/water`, settings, { schema: waterSettingsReplySchema, quiet: true }),
  gradients: (id: number) => api.get(`${base(id)}/water/gradients`, gradientsReplySchema, { quiet: true }),
  previewGradients: (id: number, settings: GradientSettings) => api.post(`${base(id)}/water/gradients/preview`, settings, { schema: gradientsReplySchema, quiet: true }),
  gradientsCsvUrl: (id: number) => `${base(id)}/water/gradients.csv`,
};

import { onMounted, ref, type Ref } from 'vue';
import type { Catchment } from '@shared/schemas/catchments';
import { catchmentsApi } from 'src/api/catchments';

/** The organisation's catchments (first hundred by name, archived left out) as select options, loaded on mount. */
export function useCatchmentOptions(keep: (c: Catchment) => boolean = () => true): Ref<{ label: string; value: number }[]> {
  const options = ref<{ label: string; value: number }[]>([]);
  onMounted(async () => {
    const list = await catchmentsApi.list({ page: 1, perPage: 100, sort: 'name', descending: false, search: '', archived: false });
    options.value = list.catchments.filter(keep).map((c) => ({ label: c.name, value: c.id }));
  });
  return options;
}

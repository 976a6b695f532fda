import { HydrologyInputError } from '../../../shared/hydrology/errors';
import { validationFailed } from '../../errors';

/**
 * Runs a computation of shared/hydrology and turns its refusal into a 422 naming the field (the
 * first issue's path, e.g. `gradients.overrides.profiles[6].peakElevationM`) and every issue.
 * @param prefix prepended to the library's paths, so they name the request's fields
 */
export async function refusingInput<T>(work: () => T | Promise<T>, prefix = ''): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (!(error instanceof HydrologyInputError)) throw error;
    const issues = error.issues.map((i) => ({ field: prefix ? `${prefix}.${i.path}` : i.path, message: i.message }));
    throw validationFailed(`${issues[0].field}: ${issues[0].message}`, issues[0].field, { issues });
  }
}

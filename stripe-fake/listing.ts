import { z } from 'zod';
import { noSuch } from './errors';
import { expandParam, formInteger } from './params';
import type { ListObject } from './types';

export const listParams = {
  limit: formInteger.min(1).max(100).optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
  expand: expandParam,
};

interface Page {
  limit?: number;
  starting_after?: string;
  ending_before?: string;
}

/** One page of a newest-first list, with the service's cursor parameters. */
export function toList<T extends { id: string }>(items: T[], page: Page, url: string): ListObject<T> {
  const limit = page.limit ?? 10;
  let start = 0;
  let end = items.length;
  if (page.starting_after) {
    const index = items.findIndex((item) => item.id === page.starting_after);
    if (index < 0) throw noSuch('object', page.starting_after, 'starting_after');
    start = index + 1;
  } else if (page.ending_before) {
    const index = items.findIndex((item) => item.id === page.ending_before);
    if (index < 0) throw noSuch('object', page.ending_before, 'ending_before');
    end = index;
    start = Math.max(0, end - limit);
  }
  const data = items.slice(start, Math.min(end, start + limit));
  return { object: 'list', data, has_more: start + data.length < end, url };
}

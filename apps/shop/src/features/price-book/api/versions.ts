import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import type { PriceBookVersionSummary } from '@benchwright/contracts';
import { api } from '@benchwright/ui';

type VersionsPage = { versions: PriceBookVersionSummary[]; nextCursor: string | null };

/** `GET /api/price-book/versions`, a page at a time; under ['price-book'], so every change of the book refreshes it. */
export const versionsQueryOptions = (limit = 10) =>
  infiniteQueryOptions({
    queryKey: ['price-book', 'versions', limit],
    queryFn: ({ pageParam }) =>
      api<VersionsPage>(
        `/price-book/versions?${new URLSearchParams({ limit: String(limit), ...(pageParam ? { cursor: pageParam } : {}) })}`,
      ),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor ?? null,
  });
export const usePriceBookVersions = (limit?: number) => useInfiniteQuery(versionsQueryOptions(limit));

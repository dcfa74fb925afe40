import { useCallback, useRef } from "react";
import type { OutputSystem } from "~/core/units";
import { getSampleDetail, type SampleDetail } from "~/utils/api/client";

/**
 * The measured grids of a sample's revision in the units on screen, for the explanation panel and the plots:
 * fetched once per sample, unit system and revision (GET /api/v1/samples/:id), then served from the cache for
 * as long as the page is open. The loader is stable across renders.
 */
export function useRevisionGrids() {
  const cache = useRef(new Map<string, Promise<SampleDetail>>());
  return useCallback(
    (
      sampleId: number,
      system: OutputSystem,
      revision: number,
    ): Promise<SampleDetail> => {
      const key = `${sampleId}:${system}:${revision}`;
      let payload = cache.current.get(key);
      if (!payload) {
        payload = getSampleDetail(sampleId, { units: system, revision }).then(
          ({ data, response }) => {
            if (!data)
              throw new Error(
                `grids of sample ${sampleId}: ${response.status}`,
              );
            return data;
          },
        );
        cache.current.set(key, payload);
      }
      return payload;
    },
    [],
  );
}

import { expect, test } from "vitest";
import { datasetFromCanonicalGrids, runQc } from "~/core/lab-data";
import { DEMO_SAMPLES, demoGrids } from "./seed";

// The invented demo tables are built from published correlations (app/core/properties) with a little noise;
// they must keep the trends the physics requires, so the lab-data QC finds nothing to warn about.
test.each(DEMO_SAMPLES.map((s, i) => [s.label, s, i] as const))(
  "demo sample %s passes the QC checks",
  (_label, sample, index) => {
    const g = demoGrids(sample, index + 1);
    const dataset = datasetFromCanonicalGrids({
      properties: Object.fromEntries(
        g.grids.map((x) => [
          x.property,
          {
            pressures: x.pressures,
            temperatures: x.temperatures,
            values: x.values,
          },
        ]),
      ),
      bubblePoints: g.bubblePoints.map((b) => ({
        temperature: b.temperatureF,
        pressure: b.bubblePointPsia,
      })),
    });
    const findings = runQc(dataset, {
      apiGravity: sample.stockTankApi,
      gasGravity: sample.gasSpecificGravity,
    });
    expect(
      findings.filter((f) => f.severity !== "info").map((f) => f.message),
    ).toEqual([]);
    expect(g.bubblePoints).toHaveLength(sample.temperaturesF.length);
  },
);

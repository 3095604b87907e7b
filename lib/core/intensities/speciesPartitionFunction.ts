import { linearPartitionFunction } from "./linearPartitionFunction.ts";
import { partitionFunction } from "./partitionFunction.ts";
import type { SpeciesModel, TemperatureK } from "../types.ts";

/** Q(T) of any species: the Dunham level sum for a diatomic, Q_vib·Q_rot for a linear molecule. */
export function speciesPartitionFunction(species: SpeciesModel, temperatureK: TemperatureK): number {
  return species.structure === "linear" ? linearPartitionFunction(species.linear, temperatureK) : partitionFunction(species.dunham, temperatureK);
}

/**
 * Parameters several calculator schemas share: length and temperature units (converted through the
 * one unit module, so routes, islands and the maths agree) and the air's humidity.
 */
import { LIMITS, lengthRangeIn, lengthToMeters, temperatureRangeIn, temperatureToCelsius } from '~/lib/acoustics';
import { choiceParam, numberParam, type Bounds } from './calc-params';

/** Feet are converted to metres before the range check; the message speaks the unit the person used. */
export function distanceBounds(unit: 'm' | 'ft', minExclusive = false): Bounds {
  return { ...lengthRangeIn(unit, LIMITS.distanceMeters), minExclusive };
}

/** Air temperature limits in the unit given; °F bounds are the °C ones converted. */
export function temperatureBounds(unit: 'C' | 'F'): Bounds {
  return temperatureRangeIn(unit, LIMITS.temperatureCelsius);
}

export const toMeters = lengthToMeters;
export const toCelsius = temperatureToCelsius;

export const unitParam = choiceParam('unit', ['m', 'ft']).default('m');
export const tempUnitParam = choiceParam('tempUnit', ['C', 'F'], 'upper').default('C');
export const temperatureParam = numberParam('temp', 'the air temperature', '20');
export const humidityParam = numberParam('rh', 'the relative humidity in %', '50');
export const HUMIDITY_HINT = 'Relative humidity runs from 0 % (dry) to 100 % (saturated).';

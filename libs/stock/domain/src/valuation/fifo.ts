/**
 * First in, first out (IAS 2.25's other permitted formula), for comparison with the weighted
 * average and for tenants whose accountant asks for it. Each inflow is a cost layer; an
 * outflow consumes the oldest layers first. A layer partly consumed keeps its exact value:
 * the part taken is costed layerValue × q ÷ layerQty (rounded half-even) and the last unit of
 * a layer takes what remains, so value = Σ in − Σ out exactly here too.
 */
import { extendCost, type Minor } from '../money';
import { fail } from '../problems';
import { mulDivRound } from '../rounding';
import {
  signedQuantity,
  type CostLine,
  type ValuationMovement,
  type ValuationOptions,
} from './movements';

/** A cost layer still in stock. */
export interface FifoLayer {
  quantity: number;
  value: Minor;
}

/** FIFO valuation after a sequence. */
export interface FifoResult {
  quantity: number;
  value: Minor;
  layers: FifoLayer[];
  lines: CostLine[];
}

/** Takes q from the oldest layers; returns the cost. Mutates `layers`. */
function consume(layers: FifoLayer[], q: number): Minor {
  let left = q;
  let cost = 0;
  while (left > 0) {
    const layer = layers[0];
    const take = Math.min(left, layer.quantity);
    const part =
      take === layer.quantity ? layer.value : mulDivRound(layer.value, take, layer.quantity);
    cost += part;
    layer.quantity -= take;
    layer.value -= part;
    if (layer.quantity === 0) layers.shift();
    left -= take;
  }
  return cost;
}

/**
 * Folds a product's movements into FIFO layers. Inflows without a unit cost (a return or a
 * found adjustment) come in at the cost of the newest layer. Stock may not go below zero
 * under FIFO (there would be no layer to cost it from); `allowNegative` is not supported.
 */
export function fifoCost(
  movements: readonly ValuationMovement[],
  options: Pick<ValuationOptions, 'decimals'> = {},
): FifoResult {
  const decimals = options.decimals ?? 0;
  const layers: FifoLayer[] = [];
  const lines: CostLine[] = [];
  let lastUnitCost: Minor | null = null;
  movements.forEach((m, index) => {
    const dq = signedQuantity(m);
    let value = 0;
    if (dq > 0) {
      const given = 'unitCost' in m ? m.unitCost : undefined;
      const unit =
        given ??
        lastUnitCost ??
        fail(`movements[${index}].unitCost`, 'no-cost-known', 'give the unit cost');
      lastUnitCost = unit;
      value = extendCost(dq, unit, decimals);
      layers.push({ quantity: dq, value });
    } else if (dq < 0) {
      const onHand = layers.reduce((s, l) => s + l.quantity, 0);
      if (-dq > onHand) {
        fail(`movements[${index}].quantity`, 'insufficient-stock', `only ${onHand} in stock`);
      }
      value = -consume(layers, -dq);
    }
    lines.push({ index, kind: m.kind, quantity: dq, value, settlement: 0 });
  });
  return {
    quantity: layers.reduce((s, l) => s + l.quantity, 0),
    value: layers.reduce((s, l) => s + l.value, 0),
    layers,
    lines,
  };
}

/**
 * A consultant's own installed prices, kept per consultant: the composer hands them to the engine
 * in place of the illustrative demo table for plants priced in the same currency.
 */
import { getDb } from '../../db/client';
import { findPriceTable, upsertPriceTable } from '../../db/queries/reports';
import { DEMO_INSTALLED_COST_TABLE } from '../../engine';
import type { PriceTableRequest, PriceTableResponse } from '../../schemas/reports';
import type { SessionUser } from '../session';

function demo(): PriceTableResponse['demo'] {
  const { illustrative: _illustrative, ...table } = DEMO_INSTALLED_COST_TABLE;
  return {
    priceTable: {
      ...table,
      pipeOuterDiametersM: [...table.pipeOuterDiametersM],
      thicknessesM: [...table.thicknessesM],
      costPerMetre: table.costPerMetre.map((row) => [...row]),
      fittingCoverCostEach: [...table.fittingCoverCostEach],
    },
    note: 'Lagwise’s illustrative demo prices, invented for the demonstration: a starting grid to overwrite with your own.',
  };
}

function answer(row: Awaited<ReturnType<typeof findPriceTable>>): PriceTableResponse {
  return {
    prices: row ? { currency: row.currency, priceTable: row.priceTable as PriceTableResponse['demo']['priceTable'], updatedAt: row.updatedAt.toISOString() } : null,
    demo: demo(),
  };
}

/** GET /api/consultants/me/prices. */
export async function getMyPrices(user: SessionUser): Promise<PriceTableResponse> {
  return answer(await findPriceTable(getDb(), user.id));
}

/** PUT /api/consultants/me/prices: replaces the table whole. */
export async function putMyPrices(user: SessionUser, request: PriceTableRequest): Promise<PriceTableResponse> {
  return answer(await upsertPriceTable(getDb(), user.id, request.currency, request.priceTable));
}

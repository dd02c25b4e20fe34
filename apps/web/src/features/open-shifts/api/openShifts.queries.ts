import { queryOptions } from '@tanstack/react-query';
import {
  type CreateOutsideOfferDto,
  type FillOutsideOfferDto,
  OPEN_SHIFT_ROUTES,
  type OpenShiftDto,
  type OutsideOfferDto,
  type WhatItWouldTakeDto,
} from '@rotaplex/contracts';
import { api } from '@/api/client';
import { swapKeys } from '@/features/swaps/api/swaps.queries';

/** Under the open-shift list's key, so any change to the list refreshes these too. */
export const openShiftKeys = {
  whatItWouldTake: (o: OpenShiftDto) =>
    [
      ...swapKeys.openShifts(),
      'what-it-would-take',
      o.rosterPeriodId,
      o.date,
      o.shiftTypeId,
      o.skillId,
    ] as const,
};

/** For one open shift: who could take it and which rules each would break (managers). */
export const whatItWouldTakeQuery = (o: OpenShiftDto) =>
  queryOptions({
    queryKey: openShiftKeys.whatItWouldTake(o),
    queryFn: ({ signal }) =>
      api.get<WhatItWouldTakeDto>(
        OPEN_SHIFT_ROUTES.whatItWouldTake,
        {
          rosterPeriodId: o.rosterPeriodId,
          date: o.date,
          shiftTypeId: o.shiftTypeId,
          skillId: o.skillId ?? '',
        },
        signal,
      ),
  });

export const offerOutside = (body: CreateOutsideOfferDto) =>
  api.post<OutsideOfferDto>(OPEN_SHIFT_ROUTES.outsideOffers, body);

export const withdrawOutsideOffer = (id: string) =>
  api.post<OutsideOfferDto>(OPEN_SHIFT_ROUTES.outsideOfferWithdraw(id));

export const fillOutsideOffer = (id: string, body: FillOutsideOfferDto) =>
  api.post<OutsideOfferDto>(OPEN_SHIFT_ROUTES.outsideOfferFilled(id), body);

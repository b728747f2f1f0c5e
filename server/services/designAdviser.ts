import { setImmediate as nextTurn } from "node:timers/promises";
import { adviceProblemFor, adviseSteps, type AdviceResult } from "../../shared/advisor";
import { MAX_SEARCH_DESIGNS, type DesignAdviceJson, type DesignAdviceRequest } from "../../shared/schemas/design-advice";
import { designSearchSettingsOf } from "../../shared/schemas/pricing";
import { AppError, ValidationError } from "../errors";
import { presentDesignAdvice } from "../presenters/design-advice";
import { buildModelCatalog } from "./buildModelCatalog";
import { materialCatalog } from "./materialCatalog";
import { currentPriceList } from "./shopRatesUpdater";

/** The search runs in slices this long, so the process keeps answering other requests meanwhile. */
const SLICE_MS = 25;
/** Searches at once in this process (each takes a core's worth of slices); later ones wait their turn. */
const RUNNING = 2;
/** Searches waiting beyond that are turned away: the machine is busy. */
const WAITING = 8;

let running = 0;
const queue: Array<() => void> = [];

async function takeTurn(): Promise<() => void> {
  if (running >= RUNNING) {
    if (queue.length >= WAITING) throw new AppError(429, "ADVISOR_BUSY", "The design advisor is busy with other searches; try again in a minute.");
    await new Promise<void>((resolve) => queue.push(resolve));
  } else running++;
  return () => {
    const next = queue.shift();
    if (next) next();
    else running--;
  };
}

/**
 * The designs the shop can make that meet a requirement, searched with the current materials,
 * construction settings and shop rates (the same ones the prediction and the price estimate
 * read, so each candidate's figures are theirs). Writes nothing. `gone` is set when the asker
 * has left; the search then stops at its next slice.
 */
export async function designAdviser(props: { request: DesignAdviceRequest; gone?: { value: boolean } }): Promise<DesignAdviceJson | null> {
  const [catalog, buildModel, current] = await Promise.all([materialCatalog(), buildModelCatalog(), currentPriceList()]);
  const priceList = current.data;
  const settings = designSearchSettingsOf(priceList);
  const offer = adviceProblemFor(props.request, { materials: catalog.list, priceList, settings });
  if ("fields" in offer) throw ValidationError(offer.fields);
  if (offer.designs > MAX_SEARCH_DESIGNS) {
    const message = `This search would take ${offer.designs} designs; one search takes at most ${MAX_SEARCH_DESIGNS}. Allow fewer layers, alloys or gauges.`;
    throw new AppError(400, "SEARCH_TOO_LARGE", message, { constraints: message });
  }

  const done = await takeTurn();
  try {
    const steps = adviseSteps(offer.problem, { materials: catalog.byId.get.bind(catalog.byId), buildModel, priceList, minSaturationMargin: settings.minSaturationMargin });
    let result: AdviceResult | null = null;
    let sliceEnd = performance.now() + SLICE_MS;
    while (!result) {
      const step = steps.next();
      if (step.done) result = step.value;
      else if (performance.now() > sliceEnd) {
        await nextTurn();
        if (props.gone?.value) {
          steps.return(undefined as never);
          return null;
        }
        sliceEnd = performance.now() + SLICE_MS;
      }
    }
    return presentDesignAdvice(offer.problem, result, { minSaturationMargin: settings.minSaturationMargin, currency: priceList.currency, priceListVersion: current.version });
  } finally {
    done();
  }
}

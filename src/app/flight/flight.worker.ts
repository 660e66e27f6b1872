/// <reference lib="webworker" />

import { answerFlightRequest, type FlightRequest } from './flight-protocol';

/**
 * Flight worker: runs envelopes, set-piece checks, single kicks and profile fits off the main thread,
 * so Pitchside and the planner stay responsive while thousands of trajectories are integrated.
 */
addEventListener('message', (event: MessageEvent<FlightRequest>) => {
  postMessage(answerFlightRequest(event.data));
});

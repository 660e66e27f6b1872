import { modelFromKick } from '../../shared/flight/model';
import * as R from '../../shared/flight/roots';
import { integrateFlight } from '../../shared/flight/integrate';
const k = { speed: 25, elevationDeg: 30, backspinRps: 6, sidespinRps: 4, wind: { speedMs: 4, fromDeg: 30 } };
const m = modelFromKick(k);
const orig = R.brentRoot;
console.log(integrateFlight(m).rhsEvaluations);
const c0 = R.brentCalls(); integrateFlight(m); console.log('brent f calls per flight', R.brentCalls() - c0);

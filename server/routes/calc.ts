// The calculations on their own (the Planner screen and outside checks use them). The same
// shared/hv functions run in the app for live results; these answers are the authoritative ones.
import { Router } from 'express';
import { approachBoundaries, capacitorEnergy, classifyHazardousLive, coronaOnset, dischargePlan, multiplierOutput } from '../../shared/hv';
import {
  boundariesBodySchema,
  coronaBodySchema,
  dischargeBodySchema,
  energyBodySchema,
  hazardBodySchema,
  multiplierBodySchema,
} from '../../shared/schemas/calc';
import { requireSignedIn } from '../middleware/require-role';
import { validate } from '../middleware/validate';

export function calcRouter(): Router {
  const router = Router();
  router.use(requireSignedIn);

  router.post('/energy', (req, res) => {
    res.json(capacitorEnergy(validate(energyBodySchema, req.body, 'energy input')));
  });
  router.post('/discharge', (req, res) => {
    res.json(dischargePlan(validate(dischargeBodySchema, req.body, 'discharge input')));
  });
  router.post('/hazard', (req, res) => {
    res.json(classifyHazardousLive(validate(hazardBodySchema, req.body, 'hazard input')));
  });
  router.post('/boundaries', (req, res) => {
    res.json(approachBoundaries(validate(boundariesBodySchema, req.body, 'boundary input')));
  });
  router.post('/multiplier', (req, res) => {
    res.json(multiplierOutput(validate(multiplierBodySchema, req.body, 'multiplier input')));
  });
  router.post('/corona', (req, res) => {
    res.json(coronaOnset(validate(coronaBodySchema, req.body, 'corona input')));
  });
  return router;
}

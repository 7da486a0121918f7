import { figuresToolResponse, heaterTraceToolBody, markingToolBody, markingToolResponse, runtimeToolBody } from '@splitcase/contracts';
import { route, type RouteDef } from '../../http/route';
import { decodeMarking, heaterTrace, runtime } from './tools.service';

// Bench tools read nothing of the workspace: any signed-in user may use them. POST because the
// inputs are a body, not because anything changes (nothing is stored).
export const toolRoutes: RouteDef[] = [
  route(
    {
      method: 'post',
      path: '/api/tools/marking',
      tag: 'Bench tools',
      summary: 'Decode a resistor or capacitor marking ({ code, kind }) or colour bands ({ bands }): every valid reading, ranked, with its rule, value, tolerance, meaning, preferred values',
      access: 'signed-in',
      body: markingToolBody,
      response: markingToolResponse,
    },
    ({ body }) => decodeMarking(body),
  ),
  route(
    {
      method: 'post',
      path: '/api/tools/heater-trace',
      tag: 'Bench tools',
      summary: 'Copper heater trace: resistance at temperature, power, IPC-2221 current and width, power density (inputs take units)',
      access: 'signed-in',
      body: heaterTraceToolBody,
      response: figuresToolResponse,
    },
    ({ body }) => heaterTrace(body),
  ),
  route(
    {
      method: 'post',
      path: '/api/tools/runtime',
      tag: 'Bench tools',
      summary: 'Battery runtime: pack energy, runtime at a load, C-rate, air-transport class, specific energy (inputs take units)',
      access: 'signed-in',
      body: runtimeToolBody,
      response: figuresToolResponse,
    },
    ({ body }) => runtime(body),
  ),
];

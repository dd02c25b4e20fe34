// Solves one model with GLPK (glpk.js, GLPK compiled to WebAssembly) as the second, independent
// solver of the external tests. glpk.js is an ES module only, which jest's CommonJS runtime cannot
// load on Node 20, so the tests run this file in a child `node` process:
//   stdin  {"lp": <glpk.js LP object>, "options": {...}}
//   stdout {"status": "optimal" | "feasible" | "infeasible" | "undefined" | "unbounded", "z": number,
//           "vars": {name: value}, "glpkVersion": string}
import GLPK from 'glpk.js/node';

const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const { lp, options } = JSON.parse(Buffer.concat(chunks).toString('utf8'));

const glpk = await GLPK();
const out = glpk.solve(lp, { msglev: glpk.GLP_MSG_OFF, presol: true, ...options });
const names = {
  [glpk.GLP_OPT]: 'optimal',
  [glpk.GLP_FEAS]: 'feasible',
  [glpk.GLP_NOFEAS]: 'infeasible',
  [glpk.GLP_INFEAS]: 'infeasible',
  [glpk.GLP_UNBND]: 'unbounded',
  [glpk.GLP_UNDEF]: 'undefined',
};
process.stdout.write(
  JSON.stringify({
    status: names[out.result.status] ?? `status ${out.result.status}`,
    z: out.result.z,
    vars: out.result.vars,
    glpkVersion: glpk.version,
  }),
);

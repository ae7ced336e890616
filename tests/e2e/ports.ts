// Where the end-to-end server listens. E2E_PORT lets two runs share a machine
// (each also needs its own NEXT_DIST_DIR build folder); the stand-ins sit above it.
export const E2E_PORT = Number(process.env.E2E_PORT ?? 3100);
export const E2E_BASE_URL = `http://localhost:${E2E_PORT}`;
export const E2E_SERVICE_PORTS = { s3: E2E_PORT + 1471, mail: E2E_PORT + 1511, payments: E2E_PORT + 1521 };

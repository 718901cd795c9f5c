/** Two projects: node-side code (solver, shared, server, integration and verification tests) and the Angular app. */
module.exports = {
  // Global options such as the timeout belong here; per-project configs ignore them.
  testTimeout: 60000,
  projects: ['<rootDir>/jest.server.config.js', '<rootDir>/jest.ui.config.js'],
};

/** Two projects: node-side code (solver, shared, server, integration and verification tests) and the Angular app. */
module.exports = {
  projects: ['<rootDir>/jest.server.config.js', '<rootDir>/jest.ui.config.js'],
};

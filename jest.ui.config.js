const { createCjsPreset } = require('jest-preset-angular/presets');

/** Angular component and service specs under src/. */
module.exports = {
  ...createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json', testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env' }),
  displayName: 'app',
  roots: ['<rootDir>/src'],
  setupFilesAfterEnv: ['<rootDir>/src/setup-jest.ts'],
};

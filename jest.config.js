// One root config with a project per part of the code base; see docs/decisions/0001-test-runner.md.
const { createCjsPreset } = require('jest-preset-angular/presets');

const alias = { '^@shared/(.*)$': '<rootDir>/shared/$1' };
const nodeTransform = {
  '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.jest.json' }],
};

module.exports = {
  projects: [
    {
      displayName: 'shared',
      rootDir: __dirname,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/shared/**/*.spec.ts'],
      transform: nodeTransform,
      moduleNameMapper: alias,
    },
    {
      displayName: 'server',
      rootDir: __dirname,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/tests/api/**/*.test.ts'],
      transform: nodeTransform,
      moduleNameMapper: alias,
      globalSetup: '<rootDir>/tests/helpers/global-setup.ts',
    },
    {
      displayName: 'client',
      rootDir: __dirname,
      ...createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' }),
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/tests/helpers/client-setup.ts'],
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      moduleNameMapper: alias,
    },
    {
      displayName: 'e2e',
      rootDir: __dirname,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/tests/e2e/**/*.test.ts'],
      transform: nodeTransform,
      moduleNameMapper: alias,
      globalSetup: '<rootDir>/tests/helpers/e2e-global-setup.ts',
    },
  ],
};

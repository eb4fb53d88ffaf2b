// Lint configuration: the TypeScript-aware recommended rules, nothing project-specific yet.
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['node_modules/', '_site/', 'dist/', '.tmp/', 'test/fixtures/', 'example-bulletin/', 'coverage/'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
);

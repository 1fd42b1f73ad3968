import tseslint from "typescript-eslint";

export default tseslint.config(
  { ignores: [".next/**", ".next-*/**", "tmp/**", "node_modules/**", ".data/**", "next-env.d.ts"] },
  ...tseslint.configs.recommended,
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
);

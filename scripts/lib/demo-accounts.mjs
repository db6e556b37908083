// The demo sign-ins printed by npm start (kept in step with lib/server/demo/scenario.ts and README).
export const DEMO_ACCOUNTS_TEXT = `
  Demo sign-ins (password for all: fallbook-demo)
    coordinator  maren@wenlow-water.test
    advisor      tobias@wenlow-water.test   ines@wenlow-water.test
    farmer       gwen@wenlow-water.test     hallie@wenlow-water.test   samuel@wenlow-water.test

`;

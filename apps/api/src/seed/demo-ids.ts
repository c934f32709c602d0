/** Fixed ids of the invented demo records, so every seed module can refer to them and stay idempotent. */
export const demoShopIds = {
  quillfeather: "6d1c2a57-3f0e-4b8a-9c41-0a7f5e2b9d01",
  ostrander: "6d1c2a57-3f0e-4b8a-9c41-0a7f5e2b9d02",
} as const;

export const demoUserIds = {
  maren: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a01",
  imke: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a02",
  teodor: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a03",
  sunniva: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a04",
  callum: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a05",
  halvard: "a3e0f1c4-5b6d-4e7f-8a9b-1c2d3e4f5a06",
} as const;

// What the app must set so uploadthing@7 talks to the local uploads fake instead of the hosted
// service (names read from uploadthing's config module, which maps UPLOADTHING_<NAME> to its keys):
//
//   UPLOADTHING_TOKEN                base64 of JSON { apiKey, appId, regions }; the SDK's token schema
//                                    insists that apiKey starts with "sk_". The region is unused
//                                    once INGEST_URL is set.
//   UPLOADTHING_INGEST_URL           where presigned upload URLs point and where the route handler
//                                    registers route-metadata: the fake's own address.
//   UPLOADTHING_API_URL              base of the UTApi management calls (/v6/listFiles, …): the fake.
//   UPLOADTHING_UFS_HOST             host used by UTApi.generateSignedURL. The SDK picks http only when
//                                    the host contains "local", so 127.0.0.1 is written as localhost.
//   UPLOADTHING_UFS_APP_ID_LOCATION  "path": signed URLs become http://localhost:PORT/a/APPID/KEY,
//                                    which the fake serves (a subdomain would need wildcard DNS).
//   UPLOADTHING_CALLBACK_URL         the app's route handler (e.g. http://localhost:3000/api/uploadthing);
//                                    the fake posts upload callbacks there in production mode.
//   UPLOADTHING_IS_DEV               optional. Unset, the SDK follows NODE_ENV: `next dev` streams
//                                    callbacks through the route-metadata response, `next start`
//                                    receives them by POST. The fake speaks both.
//
// The file URLs the SDK then reports (ufsUrl, url) are the fake's own `${fakeUrl}/f/${key}` — it
// decides them in its PUT answer and in the callback — and appUrl is `${fakeUrl}/a/${appId}/${key}`.
export type UploadthingEnvOptions = {
  fakeUrl: string;
  apiKey: string;
  appId: string;
  callbackUrl: string;
  isDev?: boolean;
};

export function uploadthingToken(apiKey: string, appId: string): string {
  return Buffer.from(JSON.stringify({ apiKey, appId, regions: ["local"] })).toString("base64");
}

export function uploadthingEnv({ fakeUrl, apiKey, appId, callbackUrl, isDev }: UploadthingEnvOptions): Record<string, string> {
  if (!apiKey.startsWith("sk_")) throw new Error('the uploads fake API key must start with "sk_" (uploadthing rejects other tokens)');
  const url = new URL(fakeUrl);
  const loopback = ["127.0.0.1", "[::1]", "::1"].includes(url.hostname);
  const ufsHost = loopback ? `localhost${url.port ? `:${url.port}` : ""}` : url.host;
  return {
    UPLOADTHING_TOKEN: uploadthingToken(apiKey, appId),
    UPLOADTHING_INGEST_URL: url.origin,
    UPLOADTHING_API_URL: url.origin,
    UPLOADTHING_UFS_HOST: ufsHost,
    UPLOADTHING_UFS_APP_ID_LOCATION: "path",
    UPLOADTHING_CALLBACK_URL: callbackUrl,
    ...(isDev === undefined ? {} : { UPLOADTHING_IS_DEV: String(isDev) }),
  };
}

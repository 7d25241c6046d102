// OPC UA test peer for the SoftSensor client tests: a node-opcua server on 127.0.0.1 with a
// small invented reactor address space (demo data only, not from any plant).
//
// usage: node opcua-server.js PORT
// environment:
//   OPCUA_UPDATE_MS          period of the simulated tag updates (default 100)
//   OPCUA_TOKEN_LIFETIME_MS  longest secure-channel token lifetime the server grants (default 600000)
//   OPCUA_USER, OPCUA_PASSWORD  when set, a user-name token policy (SecurityPolicy None) is added
//   OPCUA_BULK_COUNT         number of variables under Objects/Reactor1/Bulk (default 40, for BrowseNext)
//   OPCUA_PLANT_TAGS         comma-separated tag names: writable Double variables under Objects/Plant
//                            (node id s=Plant.<name>), BadWaitingForInitialData until a client writes
//                            them (value, status and source timestamp as written); no timer touches them
//   OPCUA_SECURE_PKI         when set: secure-only endpoints (Basic256Sha256, Aes128_Sha256_RsaOaep and
//                            Aes256_Sha256_RsaPss, each Sign and SignAndEncrypt; no None endpoint, no anonymous
//                            sessions), the server's own PKI (certificate created on first start) in this folder;
//                            client certificates are accepted unless OPCUA_REJECT_CLIENTS=1
// Prints "listening PORT" on stdout once the endpoint accepts connections; stops on SIGTERM/SIGINT.
"use strict";
const opcua = require("node-opcua");

const port = parseInt(process.argv[2] || "4840", 10);
const updateMs = parseInt(process.env.OPCUA_UPDATE_MS || "100", 10);
const tokenLifetimeMs = parseInt(process.env.OPCUA_TOKEN_LIFETIME_MS || "600000", 10);
const bulkCount = parseInt(process.env.OPCUA_BULK_COUNT || "40", 10);
const plantTags = (process.env.OPCUA_PLANT_TAGS || "").split(",").filter((t) => t !== "");
const user = process.env.OPCUA_USER || "";
const password = process.env.OPCUA_PASSWORD || "";
const namespaceUri = "urn:softsensor:peer:reactor";
const securePki = process.env.OPCUA_SECURE_PKI || "";

async function main() {
  const security = {
    securityModes: [opcua.MessageSecurityMode.None],
    securityPolicies: [opcua.SecurityPolicy.None],
    allowAnonymous: true,
  };
  if (securePki !== "") {
    const accept = process.env.OPCUA_REJECT_CLIENTS !== "1";
    const serverCertificateManager = new opcua.OPCUACertificateManager({ rootFolder: securePki + "/server", automaticallyAcceptUnknownCertificate: accept });
    const userCertificateManager = new opcua.OPCUACertificateManager({ rootFolder: securePki + "/user", automaticallyAcceptUnknownCertificate: accept });
    await serverCertificateManager.initialize();
    await userCertificateManager.initialize();
    Object.assign(security, {
      securityModes: [opcua.MessageSecurityMode.Sign, opcua.MessageSecurityMode.SignAndEncrypt],
      securityPolicies: [opcua.SecurityPolicy.Basic256Sha256, opcua.SecurityPolicy.Aes128_Sha256_RsaOaep, opcua.SecurityPolicy.Aes256_Sha256_RsaPss],
      allowAnonymous: false,
      serverCertificateManager,
      userCertificateManager,
      alternateHostname: ["127.0.0.1"],
    });
  }
  const server = new opcua.OPCUAServer({
    port,
    host: "127.0.0.1",
    resourcePath: "/softsensor",
    ...security,
    defaultSecureTokenLifetime: tokenLifetimeMs,
    maxConnectionsPerEndpoint: 100,
    serverCapabilities: { maxSessions: 100 },
    userManager: {
      isValidUser: (name, pass) => user !== "" && name === user && pass === password,
    },
    buildInfo: { productName: "softsensor-test-peer", buildNumber: "1" },
  });
  await server.initialize();

  const addressSpace = server.engine.addressSpace;
  const ns = addressSpace.registerNamespace(namespaceUri);
  const reactor = ns.addObject({ organizedBy: addressSpace.rootFolder.objects, browseName: "Reactor1", nodeId: "s=Reactor1" });

  // Invented signals of a pilot fed-batch reactor (demo values): off-gas O2 and CO2 in mol %, air flow in NL/min.
  const signals = {
    OffgasO2: (t) => 20.2 + 0.3 * Math.sin(t / 7),
    OffgasCO2: (t) => 0.8 + 0.3 * Math.cos(t / 7),
    AirFlow: (t) => 10 + 0.5 * Math.sin(t / 3),
    Temperature: (t) => 30 + 0.05 * Math.sin(t),
    Counter: (t) => Math.floor(t * 1000 / updateMs),
  };
  const variables = {};
  for (const name of Object.keys(signals)) {
    variables[name] = ns.addVariable({
      componentOf: reactor,
      browseName: name,
      nodeId: "s=Reactor1." + name,
      dataType: "Double",
      accessLevel: "CurrentRead",
      userAccessLevel: "CurrentRead",
      value: { dataType: opcua.DataType.Double, value: signals[name](0) },
    });
  }

  const estimates = ns.addObject({ componentOf: reactor, browseName: "Estimates", nodeId: "s=Reactor1.Estimates" });
  for (const name of ["GrowthRate", "Biomass", "OUR", "CER", "RQ"]) {
    ns.addVariable({
      componentOf: estimates,
      browseName: name,
      nodeId: "s=Reactor1.Estimates." + name,
      dataType: "Double",
      accessLevel: "CurrentRead | CurrentWrite",
      userAccessLevel: "CurrentRead | CurrentWrite",
      value: { dataType: opcua.DataType.Double, value: 0 },
    });
  }

  const bulk = ns.addObject({ componentOf: reactor, browseName: "Bulk", nodeId: "s=Reactor1.Bulk" });
  for (let i = 0; i < bulkCount; i++) {
    ns.addVariable({
      componentOf: bulk,
      browseName: "Item" + String(i).padStart(3, "0"),
      nodeId: "s=Reactor1.Bulk.Item" + String(i).padStart(3, "0"),
      dataType: "Int32",
      value: { dataType: opcua.DataType.Int32, value: i },
    });
  }

  if (plantTags.length > 0) {
    const plant = ns.addObject({ organizedBy: addressSpace.rootFolder.objects, browseName: "Plant", nodeId: "s=Plant" });
    for (const name of plantTags) {
      const v = ns.addVariable({
        componentOf: plant,
        browseName: name,
        nodeId: "s=Plant." + name,
        dataType: "Double",
        accessLevel: "CurrentRead | CurrentWrite",
        userAccessLevel: "CurrentRead | CurrentWrite",
      });
      v.setValueFromSource({ dataType: opcua.DataType.Null }, opcua.StatusCodes.BadWaitingForInitialData);
    }
  }

  const started = Date.now();
  const timer = setInterval(() => {
    const t = (Date.now() - started) / 1000;
    const now = new Date();
    for (const name of Object.keys(signals)) {
      variables[name].setValueFromSource({ dataType: opcua.DataType.Double, value: signals[name](t) }, opcua.StatusCodes.Good, now);
    }
  }, updateMs);

  await server.start();

  if (user !== "" && securePki === "") {
    // node-opcua advertises no clear-text user-name policy on a None endpoint: add one.
    for (const endpoint of server.endpoints) {
      for (const description of endpoint.endpointDescriptions()) {
        description.userIdentityTokens.push(new opcua.UserTokenPolicy({
          policyId: "username_none",
          tokenType: opcua.UserTokenType.UserName,
          securityPolicyUri: opcua.SecurityPolicy.None,
        }));
      }
    }
  }

  process.stdout.write("listening " + port + "\n");

  const stop = async () => {
    clearInterval(timer);
    await server.shutdown(0);
    process.exit(0);
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

main().catch((err) => {
  process.stderr.write("opcua-server failed: " + (err && err.stack ? err.stack : err) + "\n");
  process.exit(1);
});

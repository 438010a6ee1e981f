// Local stand-ins for the hosted services, speaking their real protocols on loopback only:
// S3 over HTTP (s3rver) and SMTP (smtp-tester). Every message the SMTP stand-in receives is kept
// as an .eml file in STANDIN_DIR/mail so a developer or a test can read it.
//
// Environment: STANDIN_DIR, S3_PORT, S3_BUCKET, SMTP_PORT, APP_ORIGIN.
// Prints one line `stand-ins ready` when both listen.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import S3rver from 's3rver';
import { S3Client, CreateBucketCommand, PutBucketCorsCommand, HeadBucketCommand } from '@aws-sdk/client-s3';

const require = createRequire(import.meta.url);
const dir = process.env.STANDIN_DIR;
const s3Port = Number(process.env.S3_PORT);
const smtpPort = Number(process.env.SMTP_PORT);
const bucket = process.env.S3_BUCKET;
const appOrigin = process.env.APP_ORIGIN;
if (!dir || !s3Port || !smtpPort || !bucket || !appOrigin) {
  console.error('stand-ins: STANDIN_DIR, S3_PORT, S3_BUCKET, SMTP_PORT and APP_ORIGIN are required');
  process.exit(2);
}

// --- S3 ---------------------------------------------------------------------------------------
const s3Dir = path.join(dir, 's3');
mkdirSync(s3Dir, { recursive: true });
const s3 = new S3rver({ address: '127.0.0.1', port: s3Port, directory: s3Dir, silent: true });
await s3.run();

const client = new S3Client({
  endpoint: `http://127.0.0.1:${s3Port}`,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  requestChecksumCalculation: 'WHEN_REQUIRED',
  responseChecksumValidation: 'WHEN_REQUIRED',
});
try {
  await client.send(new HeadBucketCommand({ Bucket: bucket }));
} catch {
  await client.send(new CreateBucketCommand({ Bucket: bucket }));
}
// Browsers upload photos straight to storage from the widget, which is served by the app's origin.
await client.send(
  new PutBucketCorsCommand({
    Bucket: bucket,
    CORSConfiguration: {
      CORSRules: [{ AllowedOrigins: [appOrigin], AllowedMethods: ['PUT', 'POST', 'GET'], AllowedHeaders: ['*'], ExposeHeaders: ['ETag'] }],
    },
  }),
);

// --- SMTP -------------------------------------------------------------------------------------
// smtp-tester listens on every interface and has no host option; pin its server to loopback.
const { SMTPServer } = require('smtp-server');
const listen = SMTPServer.prototype.listen;
SMTPServer.prototype.listen = function listenOnLoopback(port, ...rest) {
  const callback = rest.find((arg) => typeof arg === 'function');
  return listen.call(this, port, '127.0.0.1', callback);
};
const smtpTester = require('smtp-tester');
const mailDir = path.join(dir, 'mail');
mkdirSync(mailDir, { recursive: true });
const mailServer = smtpTester.init(smtpPort);
let received = 0;
mailServer.bind((_address, id, email) => {
  received += 1;
  const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${String(received).padStart(4, '0')}.eml`;
  writeFileSync(path.join(mailDir, name), email.data.endsWith('\r\n') ? email.data : `${email.data}\r\n`);
  mailServer.remove(id);
});
await new Promise((resolve, reject) => {
  mailServer.smtpServer.server.once('listening', resolve);
  mailServer.smtpServer.server.once('error', reject);
});

console.log('stand-ins ready');

async function shutdown() {
  await new Promise((resolve) => mailServer.stop(resolve));
  await s3.close();
  process.exit(0);
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);

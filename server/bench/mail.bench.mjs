/**
 * npm run bench:mail — the outbox end to end: queue N bulletins (HTML, text, a 200 kB PDF-like file and
 * a CAP-sized XML file), send them through the local capture server and store each as received; beside
 * the same messages handed straight from nodemailer to an smtp-server that only counts them. Prints
 * figures and, last, `outbox-vs-direct: R` (time through the outbox ÷ time sent directly).
 */
import 'reflect-metadata';
import { randomBytes } from 'node:crypto';
import { NestFactory } from '@nestjs/core';
import nodemailer from 'nodemailer';
import { SMTPServer } from 'smtp-server';
// Plain JavaScript run by node on the tsc build: Nest needs the decorator metadata tsc emits (tsx does not).
import { AppModule } from '../dist/app.module.js';
import { loadConfig } from '../dist/config/config.js';
import { MailService } from '../dist/mail/mail.service.js';

const N = 100;
const PDF = Buffer.concat([Buffer.from('%PDF-1.7\n'), randomBytes(200 * 1024)]);
const XML = Buffer.from(`<?xml version="1.0"?><alert>${'<area/>'.repeat(400)}</alert>`);

function message(i) {
  return {
    to: `officer.${i}@unit.example`,
    subject: `Bulletin ${i}`,
    text: 'Afternoon storms are likely. Spray in the morning.\n'.repeat(40),
    html: `<p>${'Afternoon storms are <b>likely</b>. '.repeat(80)}</p>`,
    attachments: [
      { filename: 'bulletin.pdf', contentType: 'application/pdf', content: PDF },
      { filename: 'bulletin.cap.xml', contentType: 'application/xml', content: XML },
    ],
  };
}

async function throughOutbox() {
  const app = await NestFactory.createApplicationContext(
    AppModule.register(loadConfig({ DATA_DIR: 'memory://', DEMO: '0' })),
    {
      logger: ['error'],
    },
  );
  try {
    const mail = app.get(MailService);
    const t0 = performance.now();
    await mail.enqueue(
      'bench:1',
      Array.from({ length: N }, (_, i) => message(i)),
    );
    const t1 = performance.now();
    const run = await mail.sendDue();
    const t2 = performance.now();
    if (run.sent !== N) throw new Error(`expected ${N} sent, got ${JSON.stringify(run)}`);
    return { enqueueMs: t1 - t0, sendMs: t2 - t1 };
  } finally {
    await app.close();
  }
}

async function direct() {
  let received = 0;
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    onData(stream, _session, callback) {
      stream.resume();
      stream.on('end', () => {
        received++;
        callback();
      });
    },
  });
  await new Promise((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const { port } = server.server.address();
  const transport = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
  const t0 = performance.now();
  for (let i = 0; i < N; i++) {
    const m = message(i);
    await transport.sendMail({ from: 'bulletins@unit.example', ...m, html: m.html ?? undefined });
  }
  const ms = performance.now() - t0;
  transport.close();
  await new Promise((resolve) => server.close(() => resolve()));
  if (received !== N) throw new Error(`direct: expected ${N}, got ${received}`);
  return ms;
}

const outbox = await throughOutbox();
const directMs = await direct();
const size = PDF.length + XML.length;
console.log(`${N} messages, attachments ${(size / 1024).toFixed(0)} kB each`);
console.log(`enqueue (one transaction, attachment stored once): ${outbox.enqueueMs.toFixed(0)} ms`);
console.log(
  `send through the outbox and capture server: ${outbox.sendMs.toFixed(0)} ms, ${((N * 1000) / outbox.sendMs).toFixed(1)} messages/s`,
);
console.log(
  `send directly (nodemailer → counting smtp-server): ${directMs.toFixed(0)} ms, ${((N * 1000) / directMs).toFixed(1)} messages/s`,
);
console.log(`outbox-vs-direct: ${(outbox.sendMs / directMs).toFixed(2)}`);

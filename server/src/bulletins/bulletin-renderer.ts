import { Injectable } from '@nestjs/common';
import type { BulletinContent } from '@stormhour/shared';
import { type BulletinCapOptions, bulletinCapXml } from './engine/bulletin-cap.js';
import { bulletinPdf } from './engine/bulletin-pdf.js';
import { bulletinHtml, bulletinPlainText, bulletinSms } from './engine/bulletin-text.js';

/**
 * The bulletin's renderings behind one injectable, so the service can be tested with a renderer that
 * fails (sending must then queue nothing and leave the bulletin approved).
 */
@Injectable()
export class BulletinRenderer {
  pdf(c: BulletinContent): Promise<Buffer> {
    return bulletinPdf(c);
  }

  capXml(c: BulletinContent, options: BulletinCapOptions): string {
    return bulletinCapXml(c, options);
  }

  html(c: BulletinContent): string {
    return bulletinHtml(c);
  }

  text(c: BulletinContent): string {
    return bulletinPlainText(c);
  }

  sms(c: BulletinContent): string {
    return bulletinSms(c);
  }
}

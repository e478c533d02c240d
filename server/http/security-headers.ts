import type { RequestHandler } from 'express';

/**
 * Headers helmet does not set. Permissions-Policy: Beadloom uses no camera, microphone, location,
 * payment, USB, serial, HID, sensors or screen capture, so no page (nor anything injected into one)
 * may ask for them. API answers carry `Cache-Control: no-store`: they hold members' data and must not
 * stay in a shared or browser cache after sign-out.
 */
const PERMISSIONS_POLICY = [
  'accelerometer',
  'camera',
  'display-capture',
  'geolocation',
  'gyroscope',
  'hid',
  'magnetometer',
  'microphone',
  'midi',
  'payment',
  'serial',
  'usb',
  'xr-spatial-tracking',
]
  .map((feature) => `${feature}=()`)
  .join(', ');

export const securityHeaders: RequestHandler = (req, res, next) => {
  res.setHeader('Permissions-Policy', PERMISSIONS_POLICY);
  if (req.path.startsWith('/api/') || req.path === '/api') res.setHeader('Cache-Control', 'no-store');
  next();
};

import { ConfigError, loadConfig } from '../../../server/config';

describe('loadConfig', () => {
  it('gives safe local defaults: loopback, port 8080, dev database on 3307', () => {
    const config = loadConfig({});
    expect(config.host).toBe('127.0.0.1');
    expect(config.port).toBe(8080);
    expect(config.db).toMatchObject({ host: '127.0.0.1', port: 3307, database: 'voltcrib_dev' });
    expect(config.publicUrl).toBe('http://127.0.0.1:8080');
    expect(config.session.secureCookies).toBe(false);
  });

  it('respects PORT, HOST and DB_PORT so two checkouts can run side by side', () => {
    const config = loadConfig({ PORT: '9090', HOST: '0.0.0.0', DB_PORT: '3317' });
    expect(config.port).toBe(9090);
    expect(config.host).toBe('0.0.0.0');
    expect(config.db.port).toBe(3317);
  });

  it('uses a Unix socket for the database only when DB_SOCKET names one', () => {
    expect(loadConfig({}).db.socketPath).toBeNull();
    expect(loadConfig({ DB_SOCKET: '/run/voltcrib/mariadb.sock' }).db.socketPath).toBe('/run/voltcrib/mariadb.sock');
    // The kernel's limit for a socket path (sun_path) is 108 bytes with the terminating NUL.
    expect(() => loadConfig({ DB_SOCKET: `/${'x'.repeat(120)}` })).toThrow(ConfigError);
  });

  it('turns on Secure cookies when the public URL is HTTPS', () => {
    const config = loadConfig({ PUBLIC_URL: 'https://hv.example.org/', SESSION_SECRET: 'x'.repeat(32) });
    expect(config.session.secureCookies).toBe(true);
    expect(config.publicUrl).toBe('https://hv.example.org');
  });

  it('refuses a production start without a session secret', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(ConfigError);
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
  });

  it('names every bad variable', () => {
    try {
      loadConfig({ PORT: 'eighty', DB_NAME: 'x;drop' });
      throw new Error('expected a ConfigError');
    } catch (error) {
      expect(error).toBeInstanceOf(ConfigError);
      expect(String(error)).toMatch(/PORT/);
      expect(String(error)).toMatch(/DB_NAME/);
    }
  });
});

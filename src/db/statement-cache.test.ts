import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import Database from 'libsql';
import { afterAll, describe, expect, it } from 'vitest';
import { cachedStatementCount } from './statement-cache';

describe('statement cache', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tl-stmt-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('hands back the same prepared statement for the same SQL on one connection only', () => {
    const a = new Database(':memory:');
    const b = new Database(':memory:');
    const first = a.prepare('select 1 as one');
    expect(a.prepare('select 1 as one')).toBe(first);
    expect(a.prepare('select 2 as two')).not.toBe(first);
    expect(b.prepare('select 1 as one')).not.toBe(first);
    expect(cachedStatementCount(a)).toBe(2);
    a.close();
    b.close();
  });

  it('gives fresh results for new bindings, after a failure, and after the schema changes', () => {
    const db = new Database(':memory:');
    db.exec('create table racks (id integer primary key, name text not null unique)');
    const insert = 'insert into racks (name) values (?)';
    db.prepare(insert).run('Amp rack A');
    expect(() => db.prepare(insert).run('Amp rack A')).toThrow(/UNIQUE/);
    db.prepare(insert).run('Amp rack B');
    const byName = 'select id, name from racks where name = ?';
    expect(db.prepare(byName).all('Amp rack B')).toEqual([{ id: 2, name: 'Amp rack B' }]);
    expect(db.prepare(byName).all('Amp rack A')).toEqual([{ id: 1, name: 'Amp rack A' }]);
    // SQLite re-prepares a kept statement itself when the schema under it changes.
    db.exec('alter table racks add column phase text');
    db.exec("update racks set phase = 'L2' where id = 2");
    expect(db.prepare('select id, name from racks where name = ?').all('Amp rack B')).toEqual([{ id: 2, name: 'Amp rack B' }]);
    expect(db.prepare('select phase from racks where id = ?').all(2)).toEqual([{ phase: 'L2' }]);
    db.close();
  });

  it('answers the columns of a statement that names them from memory, and asks again for "*"', () => {
    const db = new Database(':memory:');
    db.exec('create table racks (id integer primary key, name text)');
    const named = db.prepare('select id, name from racks');
    expect(named.columns()).toBe(named.columns());
    expect(named.columns().map((c) => c.name)).toEqual(['id', 'name']);
    // "*" is never kept: after a new column, a star select names it and returns it.
    const star = db.prepare('select * from racks');
    expect(db.prepare('select * from racks')).not.toBe(star);
    db.exec('alter table racks add column phase text');
    db.exec("insert into racks (name, phase) values ('Amp rack A', 'L1')");
    expect(db.prepare('select * from racks').columns().map((c) => c.name)).toEqual(['id', 'name', 'phase']);
    expect(db.prepare('select * from racks').all()).toEqual([{ id: 1, name: 'Amp rack A', phase: 'L1' }]);
    expect(db.prepare('select count(*) as n from racks').all()).toEqual([{ n: 1 }]);
    db.close();
  });

  it('keeps at most 200 statements per connection, oldest use first out', () => {
    const db = new Database(':memory:');
    const first = db.prepare('select 0');
    for (let i = 1; i <= 200; i++) db.prepare(`select ${i}`);
    expect(cachedStatementCount(db)).toBe(200);
    expect(db.prepare('select 0')).not.toBe(first);
    db.close();
  });

  it('leaves the client correct through transactions that roll back (a real database file)', async () => {
    const client = createClient({ url: `file:${join(dir, 'book.db')}` });
    await client.execute('create table pages (id integer primary key, title text not null unique)');
    await client.execute({ sql: 'insert into pages (title) values (?)', args: ['Power'] });
    const tx = await client.transaction('write');
    await tx.execute({ sql: 'insert into pages (title) values (?)', args: ['Rigging'] });
    await expect(tx.execute({ sql: 'insert into pages (title) values (?)', args: ['Power'] })).rejects.toThrow(/UNIQUE/);
    await tx.rollback();
    const titles = async () => (await client.execute('select title from pages order by id')).rows.map((r) => r.title);
    expect(await titles()).toEqual(['Power']);
    await client.execute({ sql: 'insert into pages (title) values (?)', args: ['Rigging'] });
    expect(await titles()).toEqual(['Power', 'Rigging']);
    client.close();
  });
});

import { usageCsv } from './usage-csv';

describe('usageCsv', () => {
  it('has a header line and CRLF line ends', () => {
    const csv = usageCsv([
      {
        bucket: '2026-03-12T09:00:00.000Z',
        keyId: 'key_a',
        keyName: 'Sweep rig — Stage 3',
        userId: 'usr_1',
        route: 'POST /v1/plans',
        count: 14,
        errorCount: 2,
      },
    ]);
    expect(csv).toBe(
      'bucket,keyId,keyName,userId,route,count,errorCount\r\n' +
        '2026-03-12T09:00:00.000Z,key_a,Sweep rig — Stage 3,usr_1,POST /v1/plans,14,2\r\n',
    );
  });

  it('guards a key name that would run as a formula, but not the counts', () => {
    const csv = usageCsv([
      { bucket: null, keyId: 'key_a', keyName: ' =1+1', userId: null, route: null, count: 3, errorCount: 0 },
      { bucket: null, keyId: 'key_b', keyName: '＝1+1', userId: null, route: null, count: 1, errorCount: 1 },
    ]);
    expect(csv.split('\r\n').slice(1, 3)).toEqual([`,key_a,"' =1+1",,,3,0`, `,key_b,"'＝1+1",,,1,1`]);
  });
});

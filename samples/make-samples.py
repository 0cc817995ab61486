# Regenerates the invented demo samples (python3 make-samples.py). Values are formula-made, not measured.
# It also writes expected-totals.json: per file and meter, how many readings (or reads, or bills) and how many US
# gallons the product must store, summed here from the values as written, independently of the product's code.
import os, zipfile, io, json, datetime as dt
root=os.path.dirname(os.path.abspath(__file__))

# Gallons per unit from the exact definitions (NIST Handbook 44 App. C: 1 gal = 231 in^3, 1 in = 2.54 cm).
GAL = {'gal': 1.0, 'kgal': 1000.0, 'ccf': 100*1728/231, 'ft3': 1728/231, 'm3': 1000/3.785411784,
       'l': 1/3.785411784, 'acre-ft': 43560*1728/231}
TOTALS = {}
def tot(path, meter, value, unit, records=1):
    # value as written in the file (a string, so the total is of exactly what the file says)
    t = TOTALS.setdefault(path, {}).setdefault(meter, {'records': 0, 'gallons': 0.0})
    t['records'] += records
    t['gallons'] += float(str(value).replace(',', '.')) * GAL[unit]

def w(path, text, enc='utf-8', bom=False):
    p=os.path.join(root,path)
    data=text.encode(enc)
    if bom: data=b'\xef\xbb\xbf'+data
    open(p,'wb').write(data)

def gal(day, hour):
    # night watering window plus a little daytime use; deterministic, invented
    if hour >= 22 or hour <= 4:
        return 80 + (hour*7 + day*3) % 40 + ((hour+day) % 4)*0.25
    return (hour*5 + day) % 7 + 0.5

# 1. long hourly across fall-back in America/Los_Angeles: Nov 1 has 25 local hours (01:00 twice)
lines=['Meter #,Interval Start,Usage (Gal)']
for meter,bias in (('HOA-NORTH-01',0),('HOA-NORTH-02',5)):
    for h in range(24):
        v=f'{gal(31,h)+bias:.2f}'; lines.append(f'{meter},2026-10-31 {h:02d}:00,{v}'); tot('meters/interval-long-hourly.csv',meter,v,'gal')
    hours=[0,1,1]+list(range(2,24))
    for h in hours:
        v=f'{gal(1,h)+bias:.2f}'; lines.append(f'{meter},2026-11-01 {h:02d}:00,{v}'); tot('meters/interval-long-hourly.csv',meter,v,'gal')
w('meters/interval-long-hourly.csv','\n'.join(lines)+'\n')

# 2. wide 24 (America/Los_Angeles, Tannery Point), fall-back day folded into Hr 02
hdr=['Meter','Read Date','Units']+[f'Hr {i:02d}' for i in range(1,25)]
lines=[','.join(hdr)]
for d in ('2026-10-31','2026-11-01','2026-11-02'):
    day=int(d[-2:])
    vals=[gal(day,h) for h in range(24)]
    if d=='2026-11-01': vals[1]=vals[1]*2  # repeated 01:00-02:00 hour, both occurrences in one column
    lines.append(','.join(['OFFICE-PARK-01',d,'gal']+[f'{v:.2f}' for v in vals]))
    for v in vals: tot('meters/interval-wide-24.csv','OFFICE-PARK-01',f'{v:.2f}','gal')
w('meters/interval-wide-24.csv','\n'.join(lines)+'\n')

# 3. wide 96, semicolon, decimal comma (America/Los_Angeles)
def hhmm(m): return f'{m//60:02d}:{m%60:02d}'
hdr=['Meter','Date','Unit']+[hhmm(15*(i+1)) for i in range(96)]
lines=[';'.join(hdr)]
for d in ('2026-11-02','2026-11-03'):
    day=int(d[-2:])
    vals=[gal(day,i//4)/4 for i in range(96)]
    lines.append(';'.join(['SCHOOL-01',d,'gal']+[f'{v:.3f}'.replace('.',',') for v in vals]))
    for v in vals: tot('meters/interval-wide-96-semicolon.csv','SCHOOL-01',f'{v:.3f}','gal')
w('meters/interval-wide-96-semicolon.csv','\n'.join(lines)+'\n')

# 4. single meter, no meter column, CCF in header
lines=['Interval Start,Consumption CCF']
for h in range(24):
    v=f'{gal(3,h)/748.05:.4f}'; lines.append(f'2026-11-03 {h:02d}:00,{v}'); tot('meters/single-meter-no-meter-column.csv','SCHOOL-02',v,'ccf')
w('meters/single-meter-no-meter-column.csv','\n'.join(lines)+'\n')

# 8. Windows-1252 with a note column
lines=['Meter #,Timestamp,Usage (Gal),Note']
notes=['','Valve box lid replaced','Frost 28°F overnight','','Café patio drip line flushed','']
for h in range(6):
    v=f'{gal(5,h):.2f}'; lines.append(f'OFFICE-PARK-02,2026-11-05 {h:02d}:00,{v},{notes[h]}'); tot('meters/interval-long-windows-1252.csv','OFFICE-PARK-02',v,'gal')
w('meters/interval-long-windows-1252.csv','\r\n'.join(lines)+'\r\n', enc='cp1252')

# 9. UTF-8 with BOM, unit column, UTC instants
lines=['Meter,Timestamp,Usage,Unit']
for h in range(6):
    v=f'{gal(6,h):.2f}'; lines.append(f'HOA-NORTH-02,2026-11-06T{h+8:02d}:00:00Z,{v},Gallons'); tot('meters/interval-long-utf8-bom.csv','HOA-NORTH-02',v,'gal')
w('meters/interval-long-utf8-bom.csv','\r\n'.join(lines)+'\r\n', bom=True)

# 10. tab-delimited, 15-minute with interval column
lines=['Meter ID\tRead Date\tUsage (Gal)\tInterval (min)']
for q in range(8):
    v=f'{gal(7,0)/4+q*0.1:.2f}'; lines.append(f'OFFICE-PARK-01\t2026-11-07 {hhmm(15*q)}\t{v}\t15'); tot('meters/interval-long-tab-delimited.csv','OFFICE-PARK-01',v,'gal')
w('meters/interval-long-tab-delimited.csv','\n'.join(lines)+'\n')

# 11. US AM/PM across fall-back (America/Los_Angeles)
lines=['Meter #,Read Date,Usage (Gal)']
for label,h in (('12:00 AM',0),('1:00 AM',1),('1:00 AM',1),('2:00 AM',2),('3:00 AM',3),('4:00 AM',4)):
    lines.append(f'SCHOOL-01,11/1/2026 {label},{gal(1,h):.2f}'); tot('meters/interval-long-us-ampm.csv','SCHOOL-01',f'{gal(1,h):.2f}','gal')
w('meters/interval-long-us-ampm.csv','\n'.join(lines)+'\n')

# 12. separate date and time columns
lines=['Serial,Date,Time,Consumption,Unit']
for h in range(8):
    v=f'{gal(8,h):.2f}'; lines.append(f'HOA-NORTH-02,11/8/2026,{h:02d}:00,{v},gal'); tot('meters/interval-long-date-time-columns.csv','HOA-NORTH-02',v,'gal')
w('meters/interval-long-date-time-columns.csv','\n'.join(lines)+'\n')

# 13. spreadsheet serial dates (1900 date system)
base=(dt.date(2026,11,9)-dt.date(1899,12,30)).days
lines=['Meter #,Interval Start,Usage (Gal)']
for h in range(6):
    s=base+h/24
    lines.append(f'OFFICE-PARK-02,{s:.6f}'.rstrip('0').rstrip('.')+f',{gal(9,h):.2f}'); tot('meters/interval-long-serial-dates.csv','OFFICE-PARK-02',f'{gal(9,h):.2f}','gal')
w('meters/interval-long-serial-dates.csv','\n'.join(lines)+'\n')

# 14. spring-forward day in America/Los_Angeles (Tannery Point): no 02:00 row exists
lines=['Meter #,Interval Start,Usage (Gal)']
for h in (0,1,3,4,5):
    v=f'{gal(8,h):.2f}'; lines.append(f'OFFICE-PARK-01,2026-03-08 {h:02d}:00,{v}'); tot('meters/interval-long-spring-forward.csv','OFFICE-PARK-01',v,'gal')
w('meters/interval-long-spring-forward.csv','\n'.join(lines)+'\n')

# 5. register monthly, HOA-NORTH-01 rolls over its 4-digit dial
lines=['Meter Serial,Read Date,Register Reading,Unit']
for m,v in zip(range(6,12),['9420','9588','9761','9912','0043','0139']): lines.append(f'HOA-NORTH-01,2026-{m:02d}-01,{v},CCF')
for m,v in zip(range(6,12),['031250','031702','032190','032611','032940','033105']): lines.append(f'HOA-NORTH-02,2026-{m:02d}-01,{v},CCF')
w('meters/register-monthly.csv','\n'.join(lines)+'\n')
# Differences by hand: HOA-NORTH-01 rolls over its 4-digit dial between 9912 and 0043 (10000 - 9912 + 43 = 131).
for d in (168, 173, 151, 131, 96): tot('meters/register-monthly.csv','HOA-NORTH-01',d,'ccf')
for d in (452, 488, 421, 329, 165): tot('meters/register-monthly.csv','HOA-NORTH-02',d,'ccf')

# register with a meter swap on 2026-08-15 (old final and new initial read at the same time)
lines=['Meter Serial,Read Date,Register Reading,Unit']
for d,v in (('2026-06-01','45012'),('2026-07-01','45140'),('2026-08-01','45266'),('2026-08-15 09:00','45301'),('2026-08-15 09:00','00000'),('2026-09-01','00061'),('2026-10-01','00170')):
    lines.append(f'OFFICE-PARK-02,{d},{v},kgal')
w('meters/register-meter-swap.csv','\n'.join(lines)+'\n')
# Old register 45012 → 45301 (128, 126, 35), new register 0 → 170 (61, 109): nothing across the swap.
for d in (128, 126, 35, 61, 109): tot('meters/register-meter-swap.csv','OFFICE-PARK-02',d,'kgal')

# 6. runtime start + duration (America/Los_Angeles)
lines=['Controller,Station,Start Time,Run Time (min),Cause,Flow (gal)']
for day in (30,31):
    for st,(start,mins,gals) in enumerate([('22:00',12,118.5),('22:12',15,142.0),('22:27',9,61.2),('22:36',20,205.8)],1):
        lines.append(f'CTL-HOA-NORTH-A,{st},2026-10-{day} {start},{mins},Scheduled,{gals}')
lines.append('CTL-HOA-NORTH-A,1,2026-11-01 22:00,0,Rain Skip,')
lines.append('CTL-HOA-NORTH-A,2,2026-11-01 22:00,0,Rain Skip,')
lines.append('CTL-HOA-NORTH-A,3,2026-11-02 07:40,5,Manual,48.9')
lines.append('CTL-HOA-NORTH-A,4,2026-11-02 22:00,0,Wind skip,')
w('runtime/runtime-start-duration.csv','\n'.join(lines)+'\n')

# 7. runtime start + end with a separate date column (America/Los_Angeles); one run crosses midnight
lines=['Controller ID,Zone,Date,Start,End,Reason']
rows=[('A1','11/3/2026','9:30 PM','9:45 PM','Program A'),('A2','11/3/2026','9:45 PM','10:05 PM','Program A'),
      ('A3','11/3/2026','10:05 PM','10:20 PM','Program A'),('B1','11/3/2026','11:50 PM','12:10 AM','Program B'),
      ('A1','11/4/2026','6:15 AM','6:20 AM','Manual'),('A1','11/5/2026','9:30 PM','9:30 PM','Rain sensor')]
for z,d,s,e,r in rows: lines.append(f'CTL-SCHOOL-A,{z},{d},{s},{e},{r}')
w('runtime/runtime-start-end.csv','\n'.join(lines)+'\n')

# ---- The layout catalogue (issue 12): more layouts utilities and loggers export. Invented values. ----

# 15-minute long file, cubic feet in the header (Larkspur Park District, Phoenix: no daylight saving)
lines=['Meter ID,Read Time,Consumption (cu ft)']
for q in range(96):
    v=f'{(gal(14,q//4)/4)/7.48:.3f}'; lines.append(f'PARK-CF-01,2026-07-14 {hhmm(15*q)},{v}'); tot('meters/interval-long-15min.csv','PARK-CF-01',v,'ft3')
w('meters/interval-long-15min.csv','\n'.join(lines)+'\n')

# wide 24, hour-beginning labels (00:00 … 23:00), no unit anywhere: the meter's own unit (ft3) is used
hdr=['Meter','Date']+[f'{h:02d}:00' for h in range(24)]
lines=[','.join(hdr)]
for d in ('2026-07-15','2026-07-16'):
    vals=[f'{gal(int(d[-2:]),h)/7.48:.2f}' for h in range(24)]
    lines.append(','.join(['PARK-CF-01',d]+vals))
    for v in vals: tot('meters/interval-wide-24-hour-beginning.csv','PARK-CF-01',v,'ft3')
w('meters/interval-wide-24-hour-beginning.csv','\n'.join(lines)+'\n')

# wide 48, half-hour, hour-ending labels (00:30 … 24:00)
hdr=['Meter','Read Date','Units']+[hhmm(30*(i+1)) for i in range(48)]
lines=[','.join(hdr)]
for d in ('2026-10-20','2026-10-21'):
    vals=[f'{gal(int(d[-2:]),i//2)/2:.2f}' for i in range(48)]
    lines.append(','.join(['HOA-NORTH-01',d,'gal']+vals))
    for v in vals: tot('meters/interval-wide-48.csv','HOA-NORTH-01',v,'gal')
w('meters/interval-wide-48.csv','\n'.join(lines)+'\n')

# wide 96, hour-beginning labels (00:00 … 23:45)
hdr=['Meter','Date','Unit']+[hhmm(15*i) for i in range(96)]
lines=[','.join(hdr)]
for d in ('2026-10-22','2026-10-23'):
    vals=[f'{gal(int(d[-2:]),i//4)/4:.3f}' for i in range(96)]
    lines.append(','.join(['SCHOOL-01',d,'gal']+vals))
    for v in vals: tot('meters/interval-wide-96-hour-beginning.csv','SCHOOL-01',v,'gal')
w('meters/interval-wide-96-hour-beginning.csv','\n'.join(lines)+'\n')

# wide 96, day-first dates, semicolons and decimal commas; two meters interleaved, so the first date that only
# reads day-first (13/06/2026) is on row 26, past the rows the upload looks at first
hdr=['Meter','Date','Unit']+[hhmm(15*(i+1)) for i in range(96)]
lines=[';'.join(hdr)]
for day in range(1,21):
    for meter,bias in (('HOA-NORTH-01',0.0),('HOA-NORTH-02',0.5)):
        vals=[f'{gal(day,i//4)/4+bias:.3f}'.replace('.',',') for i in range(96)]
        lines.append(';'.join([meter,f'{day:02d}/06/2026','gal']+vals))
        for v in vals: tot('meters/interval-wide-96-day-first.csv',meter,v,'gal')
w('meters/interval-wide-96-day-first.csv','\n'.join(lines)+'\n')

# long, month-first US dates with AM/PM; 6/13/2026 (only month-first) first appears on row 26
lines=['Meter #,Read Date,Usage (Gal)']
for day in (12,13,14):
    for h in range(24):
        label=f'{(h%12) or 12}:00 {"AM" if h<12 else "PM"}'
        v=f'{gal(day,h):.2f}'; lines.append(f'OFFICE-PARK-01,6/{day}/2026 {label},{v}'); tot('meters/interval-long-month-first.csv','OFFICE-PARK-01',v,'gal')
w('meters/interval-long-month-first.csv','\n'.join(lines)+'\n')

# Windows-1252, semicolons, decimal commas, day-first dd.mm.yyyy, cubic metres named with ³
lines=['Meter;Read date;Volume (m³);Note']
notes=['','Café patio drip line flushed','','Frost 28°F overnight','','']
for h in range(6):
    v=f'{gal(14,h)/264.17:.4f}'.replace('.',','); lines.append(f'PARK-M3-02;14.07.2026 {h:02d}:00;{v};{notes[h]}'); tot('meters/interval-long-windows-1252-day-first.csv','PARK-M3-02',v,'m3')
w('meters/interval-long-windows-1252-day-first.csv','\r\n'.join(lines)+'\r\n', enc='cp1252')

# register reads with the physical meter's serial, read type, multiplier and dials; serial A-1001 (×10, 4 dials,
# rolls over 9985 → 0012) is replaced by B-2002 (×1, 5 dials) on 2026-04-15; the old final and new initial read
# share the swap time. By hand: old (9985-9950) + (10000-9985+12) + (40-12) = 90 units × 10 = 900 HCF;
# new 31 + 59 = 90 units × 1 = 90 HCF.
lines=['Service Point,Meter Serial,Read Date,Read Type,Multiplier,Dials,Register Reading,Unit']
for serial,d,kind,mult,dials,v in (('A-1001','2026-01-01','Actual',10,4,'9950'),('A-1001','2026-02-01','Estimated',10,4,'9985'),
        ('A-1001','2026-03-01','Actual',10,4,'0012'),('A-1001','2026-04-15 09:00','Actual',10,4,'0040'),
        ('B-2002','2026-04-15 09:00','Actual',1,5,'00000'),('B-2002','2026-05-01','Actual',1,5,'00031'),
        ('B-2002','2026-06-01','Estimated',1,5,'00090')):
    lines.append(f'UTIL-7001,{serial},{d},{kind},{mult},{dials},{v},HCF')
w('meters/register-serial-swap-read-type.csv','\n'.join(lines)+'\n')
for d in (350, 270, 280, 31, 59): tot('meters/register-serial-swap-read-type.csv','UTIL-7001',d,'ccf')

# billing periods (what most HOAs get from the utility): month-first dates, both ends included, HCF
lines=['Meter Number,Service From,Service To,Days,Usage (HCF),Read Type']
for a,b,days,v,kind in (('01/14/2026','02/12/2026',30,'41','Actual'),('02/13/2026','03/13/2026',29,'47','Actual'),
        ('03/14/2026','04/13/2026',31,'63','Actual'),('04/14/2026','05/13/2026',30,'88','Actual'),
        ('05/14/2026','06/12/2026',30,'102','Estimated')):
    lines.append(f'BILL-01,{a},{b},{days},{v},{kind}'); tot('billing/billing-periods.csv','BILL-01',v,'ccf')
w('billing/billing-periods.csv','\n'.join(lines)+'\n')

# one export for many sites: meters of three sites (two zones) and one nobody set up
lines=['Meter ID,Interval Start,Usage (Gal)']
for meter in ('HOA-NORTH-01','OFFICE-PARK-01','PARK-CF-01','HOA-EAST-77'):
    for h in range(6):
        v=f'{gal(2,h)+len(meter):.2f}'; lines.append(f'{meter},2026-09-02 {h:02d}:00,{v}')
        if meter!='HOA-EAST-77': tot('meters/multi-site-export.csv',meter,v,'gal')
w('meters/multi-site-export.csv','\n'.join(lines)+'\n')

# broken
w('broken/empty.csv','')
w('broken/header-only.csv','Meter #,Interval Start,Usage (Gal)\n')
w('broken/unknown-columns.csv','Colour,Shape,Flavour\nteal,round,mint\nplum,square,lime\n')
w('broken/non-numeric-volume.csv','Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2026-11-10 00:00,91.25\nHOA-NORTH-01,2026-11-10 01:00,n/a\nHOA-NORTH-01,2026-11-10 02:00,88.00\n')
w('broken/negative-volume.csv','Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2026-11-10 00:00,91.25\nHOA-NORTH-01,2026-11-10 01:00,-12.5\nHOA-NORTH-01,2026-11-10 02:00,88.00\n')
w('broken/future-timestamp.csv','Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2026-11-10 00:00,91.25\nHOA-NORTH-01,2026-11-10 01:00,90.00\nHOA-NORTH-01,2027-11-10 02:00,88.50\n')
w('broken/unknown-meter.csv','Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2026-11-10 00:00,91.25\nHOA-NORTH-01,2026-11-10 01:00,90.00\nHOA-SOUTH-99,2026-11-10 00:00,40.00\nHOA-SOUTH-99,2026-11-10 01:00,41.50\n')
w('broken/missing-required-field.csv','Controller,Station,Run Time (min),Cause\nCTL-HOA-NORTH-A,1,12,Scheduled\n')
w('broken/spring-forward-gap.csv','Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2026-03-08 01:00,20.00\nHOA-NORTH-01,2026-03-08 02:00,21.00\nHOA-NORTH-01,2026-03-08 03:00,22.00\n')
w('broken/register-not-a-rollover.csv','Meter Serial,Read Date,Register Reading,Unit\nHOA-NORTH-02,2026-09-01,5210,CCF\nHOA-NORTH-02,2026-10-01,5190,CCF\nHOA-NORTH-02,2026-11-01,5350,CCF\n')
hdr=['Meter','Read Date','Units']+[f'Hr {i:02d}' for i in range(1,25)]
vals=['5.00']*24
w('broken/wide-value-in-skipped-hour.csv',','.join(hdr)+'\n'+','.join(['OFFICE-PARK-01','2026-03-08','gal']+vals)+'\n')
buf=io.BytesIO()
with zipfile.ZipFile(buf,'w',zipfile.ZIP_DEFLATED) as z: z.writestr('usage.csv','Meter #,Interval Start,Usage (Gal)\nHOA-NORTH-01,2026-11-10 00:00,91.25\n')
open(os.path.join(root,'broken/zip-renamed.csv'),'wb').write(buf.getvalue())

for path in TOTALS:
    for meter in TOTALS[path]: TOTALS[path][meter]['gallons'] = round(TOTALS[path][meter]['gallons'], 4)
with open(os.path.join(root,'expected-totals.json'),'w') as f:
    f.write(json.dumps({'about': 'Written by make-samples.py from the values as written: per file and meter, the '
                        'readings (register files: volumes; bills: periods) and US gallons the product must store.',
                        'files': TOTALS}, indent=2, sort_keys=True)+'\n')

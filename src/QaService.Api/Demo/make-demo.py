#!/usr/bin/env python3
# Builds the invented demo scenario (Millbrook Ferry hydrant survey; town, utility and marks are invented).
# Regenerate: python3 src/QaService.Api/Demo/make-demo.py > src/QaService.Api/Demo/millbrook-ferry-hydrants.json (needs cs2cs from proj-bin).
import json, random, subprocess
random.seed(20261201)
marks=[]
for i in range(24):
    e=545000+random.uniform(0,2400); n=5330000+random.uniform(0,1800); h=312+random.uniform(-6,9)
    marks.append({"id":f"MF-{i+1:02d}","e":round(e,3),"n":round(n,3),"h":round(h,3),"sigmaH":0.008,"sigmaV":0.012})
fixes=[]
rows=[]
for i,m in enumerate(marks):
    de=random.gauss(0,0.022); dn=random.gauss(0,0.027); du=random.gauss(0.004,0.035)
    rows.append((m["e"]+de, m["n"]+dn, m["h"]+du, m["id"], i))
# two repeat occupations and one fix paired by proximity (no mark id)
for k,(j,tag) in enumerate([(3,"repeat"),(17,"repeat"),(9,"nearest")]):
    m=marks[j]; rows.append((m["e"]+random.gauss(0,0.02), m["n"]+random.gauss(0,0.02), m["h"]+random.gauss(0,0.03), None if tag=="nearest" else m["id"], 24+k))
inp="\n".join(f"{e:.4f} {n:.4f} {h:.4f}" for e,n,h,_,_ in rows)
out=subprocess.run(["cs2cs","-f","%.9f","EPSG:32633","EPSG:4979"],input=inp,capture_output=True,text=True,check=True).stdout.split("\n")
for (e,n,h,mid,i),line in zip(rows,out):
    lat,lon,hh=[float(x) for x in line.split()]
    f={"id":f"HY-{i+1:04d}","lat":round(lat,9),"lon":round(lon,9),"h":round(hh,3),"time":f"2026-06-{3+i//10:02d}T{8+i%10:02d}:15:00Z"}
    if mid: f={"id":f["id"],"mark":mid,**{k:v for k,v in f.items() if k!="id"}}
    fixes.append(f)
req={"title":"Millbrook Ferry Water Cooperative: hydrant positions, RTK batch 3 (demo data, invented)",
 "marks":{"crs":"EPSG:32633","heights":"ellipsoidal","points":marks},
 "fixes":{"crs":"EPSG:4979","heights":"ellipsoidal","epoch":2026.42,"points":fixes},
 "spec":{"standard":"nssda","horizontal":0.10,"vertical":0.15},
 "pairing":{"radius":1.0}}
print(json.dumps(req,indent=1))

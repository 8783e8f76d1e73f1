"""Calibration of the threshold interval's weights (core/thresholds/uncertainty.ts,
INTERVAL_CALIBRATION) on development data only.

Input: the JSON lines of `npx tsx tests/validation/interval-dump.ts 6 200` (development seeds
of both families' detection grids and of the day-2 pairs). For each threshold: the maximum-
likelihood fit of ln(found/true) ~ N(0, f^2 + (a*s_boot)^2 + (b*s_methods)^2), each data set
weighted equally, then the coverage per set for a grid of common scales k and short-ramp
factors ks, and the earlier weights' coverage on the same data. Needs numpy and scipy.
Run: python3 tests/validation/calibration/fit-interval.py dev.jsonl
"""
import json,sys,numpy as np
from scipy.optimize import minimize
rows=[json.loads(l) for l in open(sys.argv[1])]
f=[r for r in rows if r['found']]
def setname(r):
    s=r['set']+' '+r['condition']
    if r['condition']=='hard': s+=' short' if r['incS']<480 else ' noisy'
    return s
for tid in ['vt1','vt2']:
    R=[r for r in f if r['id']==tid]
    e=np.array([r['e'] for r in R]); boot=np.array([r['boot'] for r in R]); meth=np.array([r['meth'] for r in R])
    short=np.array([r['incS']<480 for r in R]); S=np.array([setname(r) for r in R])
    grid=np.array([not r['set'].startswith('pair') for r in R])
    cur=np.array([r['vo2Sd'] if r.get('vo2Sd') is not None else np.nan for r in R])
    # weights: each of the 4 grid sets + 2 pair sets equal total weight
    base=np.array([r['set']+' '+r['condition'] for r in R])
    w=np.zeros(len(R))
    for b in set(base): m=base==b; w[m]=1.0/m.sum()
    def model(p):
        f0,a,b=np.abs(p[:3]); return np.sqrt(f0**2+(a*boot)**2+(b*meth)**2)
    def nll(p):
        s=model(p); return np.sum(w*(np.log(s)+0.5*(e/s)**2))
    res=minimize(nll,[0.03,1,0.5],method='Nelder-Mead',options={'maxiter':4000,'xatol':1e-6,'fatol':1e-9})
    p=np.abs(res.x); s=model(p)
    print('\n==',tid,'ML f %.4f a %.3f b %.3f'%tuple(p))
    for k in [1.0,1.05,1.1,1.15,1.2]:
      for ks in [1.0,1.1,1.2]:
        sc=k*s*np.where(short,ks,1.0)
        cells=[]
        for st in ['f1 main','f1 hard','B main','B hard']:
            m=np.array([x.startswith(st) for x in S])
            cells.append('%s %.1f'%(st,100*np.mean(abs(e[m])<=1.96*sc[m])))
        sub=' '.join('%s %.1f'%(st,100*np.mean(abs(e[S==st])<=1.96*sc[S==st])) for st in sorted(set(S)) if 'hard' in st)
        pr=' '.join('%s %.1f'%(st,100*np.mean(abs(e[base==st])<=1.96*sc[base==st])) for st in ['pairA main','pairB main'])
        print('k %.2f ks %.1f | %s | %s | %s | medhalf grid %.3f'%(k,ks,' '.join(cells),sub,pr,np.median(1.96*sc[grid])))
    print('current:',' '.join('%s %.1f'%(st,100*np.nanmean(abs(e[base==st])<=1.96*cur[base==st])) for st in sorted(set(base))), 'medhalf grid %.3f'%np.nanmedian(1.96*cur[grid]))

import { luFactor, luSolve } from './src/linalg/lu.ts';
for (const n of [200, 1000, 2000]) {
  const d = new Float64Array(2*n*n); for (let i=0;i<d.length;i++) d[i]=Math.random()-0.5;
  const a = {rows:n,cols:n,data:d};
  let t=performance.now(); const f = luFactor(a); let dt=(performance.now()-t)/1000;
  const b = {rows:n, cols:1, data: new Float64Array(2*n).map(()=>Math.random())};
  const x = luSolve(f, b);
  // residual
  let r = 0, bn = 0; for (let i=0;i<n;i++){ let sr=0, si=0; for (let j=0;j<n;j++){ const ar=d[2*(i*n+j)], ai=d[2*(i*n+j)+1]; sr+=ar*x.data[2*j]-ai*x.data[2*j+1]; si+=ar*x.data[2*j+1]+ai*x.data[2*j]; } r=Math.max(r,Math.hypot(sr-b.data[2*i], si-b.data[2*i+1])); }
  console.log('lu', n, dt.toFixed(2),'s', (8*n**3/3/dt/1e9).toFixed(2),'GFLOP/s residual', r.toExponential(2));
}

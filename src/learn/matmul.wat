;; Matrix products on the wasm backend's own heap, C = op(A)·B with op(A) = A or Aᵀ.
;;
;; Every element is summed as XNNPACK's float32 GEMM sums it (the kernel behind
;; tfjs-backend-wasm's BatchMatMul): one float32 accumulator per element, starting at +0,
;; adding A[i,k]·B[k,j] rounded to float32 for k = 0, 1, …, K−1 in order. The results are
;; therefore the bits tf.matMul gives, while B is read in place: no packed copy of B per
;; call, and Aᵀ is read by stride instead of being copied by a transpose.
;; Addresses are byte offsets into the imported memory; matrices are row-major float32.
(module
  (import "tfjs" "memory" (memory 1))

  ;; A 4×8 block of C: rows r at pa + r·arow, A advancing by astep per k; B rows bstep apart;
  ;; C rows cstep apart. Eight accumulator vectors, so the block stays in registers.
  (func $tile4x8 (param $pa i32) (param $arow i32) (param $astep i32) (param $pb i32) (param $bstep i32)
                 (param $pc i32) (param $cstep i32) (param $k i32)
    (local $a0 i32) (local $a1 i32) (local $a2 i32) (local $a3 i32)
    (local $b0 v128) (local $b1 v128) (local $v v128)
    (local $c00 v128) (local $c01 v128) (local $c10 v128) (local $c11 v128)
    (local $c20 v128) (local $c21 v128) (local $c30 v128) (local $c31 v128)
    (local.set $a0 (local.get $pa))
    (local.set $a1 (i32.add (local.get $a0) (local.get $arow)))
    (local.set $a2 (i32.add (local.get $a1) (local.get $arow)))
    (local.set $a3 (i32.add (local.get $a2) (local.get $arow)))
    (block $done
      (br_if $done (i32.eqz (local.get $k)))
      (loop $next
        (local.set $b0 (v128.load (local.get $pb)))
        (local.set $b1 (v128.load offset=16 (local.get $pb)))
        (local.set $v (v128.load32_splat (local.get $a0)))
        (local.set $c00 (f32x4.add (local.get $c00) (f32x4.mul (local.get $v) (local.get $b0))))
        (local.set $c01 (f32x4.add (local.get $c01) (f32x4.mul (local.get $v) (local.get $b1))))
        (local.set $v (v128.load32_splat (local.get $a1)))
        (local.set $c10 (f32x4.add (local.get $c10) (f32x4.mul (local.get $v) (local.get $b0))))
        (local.set $c11 (f32x4.add (local.get $c11) (f32x4.mul (local.get $v) (local.get $b1))))
        (local.set $v (v128.load32_splat (local.get $a2)))
        (local.set $c20 (f32x4.add (local.get $c20) (f32x4.mul (local.get $v) (local.get $b0))))
        (local.set $c21 (f32x4.add (local.get $c21) (f32x4.mul (local.get $v) (local.get $b1))))
        (local.set $v (v128.load32_splat (local.get $a3)))
        (local.set $c30 (f32x4.add (local.get $c30) (f32x4.mul (local.get $v) (local.get $b0))))
        (local.set $c31 (f32x4.add (local.get $c31) (f32x4.mul (local.get $v) (local.get $b1))))
        (local.set $a0 (i32.add (local.get $a0) (local.get $astep)))
        (local.set $a1 (i32.add (local.get $a1) (local.get $astep)))
        (local.set $a2 (i32.add (local.get $a2) (local.get $astep)))
        (local.set $a3 (i32.add (local.get $a3) (local.get $astep)))
        (local.set $pb (i32.add (local.get $pb) (local.get $bstep)))
        (br_if $next (local.tee $k (i32.sub (local.get $k) (i32.const 1))))))
    (v128.store (local.get $pc) (local.get $c00))
    (v128.store offset=16 (local.get $pc) (local.get $c01))
    (local.set $pc (i32.add (local.get $pc) (local.get $cstep)))
    (v128.store (local.get $pc) (local.get $c10))
    (v128.store offset=16 (local.get $pc) (local.get $c11))
    (local.set $pc (i32.add (local.get $pc) (local.get $cstep)))
    (v128.store (local.get $pc) (local.get $c20))
    (v128.store offset=16 (local.get $pc) (local.get $c21))
    (local.set $pc (i32.add (local.get $pc) (local.get $cstep)))
    (v128.store (local.get $pc) (local.get $c30))
    (v128.store offset=16 (local.get $pc) (local.get $c31)))

  ;; A 4×4 block of C (the last columns when fewer than 8 remain), as $tile4x8 with one vector per row.
  (func $tile4x4 (param $pa i32) (param $arow i32) (param $astep i32) (param $pb i32) (param $bstep i32)
                 (param $pc i32) (param $cstep i32) (param $k i32)
    (local $a0 i32) (local $a1 i32) (local $a2 i32) (local $a3 i32)
    (local $b0 v128) (local $c0 v128) (local $c1 v128) (local $c2 v128) (local $c3 v128)
    (local.set $a0 (local.get $pa))
    (local.set $a1 (i32.add (local.get $a0) (local.get $arow)))
    (local.set $a2 (i32.add (local.get $a1) (local.get $arow)))
    (local.set $a3 (i32.add (local.get $a2) (local.get $arow)))
    (block $done
      (br_if $done (i32.eqz (local.get $k)))
      (loop $next
        (local.set $b0 (v128.load (local.get $pb)))
        (local.set $c0 (f32x4.add (local.get $c0) (f32x4.mul (v128.load32_splat (local.get $a0)) (local.get $b0))))
        (local.set $c1 (f32x4.add (local.get $c1) (f32x4.mul (v128.load32_splat (local.get $a1)) (local.get $b0))))
        (local.set $c2 (f32x4.add (local.get $c2) (f32x4.mul (v128.load32_splat (local.get $a2)) (local.get $b0))))
        (local.set $c3 (f32x4.add (local.get $c3) (f32x4.mul (v128.load32_splat (local.get $a3)) (local.get $b0))))
        (local.set $a0 (i32.add (local.get $a0) (local.get $astep)))
        (local.set $a1 (i32.add (local.get $a1) (local.get $astep)))
        (local.set $a2 (i32.add (local.get $a2) (local.get $astep)))
        (local.set $a3 (i32.add (local.get $a3) (local.get $astep)))
        (local.set $pb (i32.add (local.get $pb) (local.get $bstep)))
        (br_if $next (local.tee $k (i32.sub (local.get $k) (i32.const 1))))))
    (v128.store (local.get $pc) (local.get $c0))
    (local.set $pc (i32.add (local.get $pc) (local.get $cstep)))
    (v128.store (local.get $pc) (local.get $c1))
    (local.set $pc (i32.add (local.get $pc) (local.get $cstep)))
    (v128.store (local.get $pc) (local.get $c2))
    (local.set $pc (i32.add (local.get $pc) (local.get $cstep)))
    (v128.store (local.get $pc) (local.get $c3)))

  ;; One element of C, for the edges no block covers.
  (func $dot (param $pa i32) (param $astep i32) (param $pb i32) (param $bstep i32) (param $pc i32) (param $k i32)
    (local $c f32)
    (block $done
      (br_if $done (i32.eqz (local.get $k)))
      (loop $next
        (local.set $c (f32.add (local.get $c) (f32.mul (f32.load (local.get $pa)) (f32.load (local.get $pb)))))
        (local.set $pa (i32.add (local.get $pa) (local.get $astep)))
        (local.set $pb (i32.add (local.get $pb) (local.get $bstep)))
        (br_if $next (local.tee $k (i32.sub (local.get $k) (i32.const 1))))))
    (f32.store (local.get $pc) (local.get $c)))

  ;; C [m, n] = op(A)·B: A is [m, k], or [k, m] when transposeA ≠ 0; B is [k, n].
  (func (export "matmul") (param $a i32) (param $b i32) (param $c i32) (param $m i32) (param $k i32) (param $n i32)
                          (param $transposeA i32)
    (local $arow i32) (local $astep i32) (local $row i32) (local $i i32) (local $j i32)
    (local $m4 i32) (local $n8 i32) (local $n4 i32)
    (local.set $row (i32.shl (local.get $n) (i32.const 2)))
    (if (local.get $transposeA)
      (then (local.set $arow (i32.const 4)) (local.set $astep (i32.shl (local.get $m) (i32.const 2))))
      (else (local.set $arow (i32.shl (local.get $k) (i32.const 2))) (local.set $astep (i32.const 4))))
    (local.set $m4 (i32.and (local.get $m) (i32.const -4)))
    (local.set $n8 (i32.and (local.get $n) (i32.const -8)))
    (local.set $n4 (i32.and (local.get $n) (i32.const -4)))
    (local.set $i (i32.const 0))
    (block $blocksDone (loop $blockRows
      (br_if $blocksDone (i32.ge_u (local.get $i) (local.get $m4)))
      (local.set $j (i32.const 0))
      (block $wideDone (loop $wide
        (br_if $wideDone (i32.ge_u (local.get $j) (local.get $n8)))
        (call $tile4x8
          (i32.add (local.get $a) (i32.mul (local.get $i) (local.get $arow))) (local.get $arow) (local.get $astep)
          (i32.add (local.get $b) (i32.shl (local.get $j) (i32.const 2))) (local.get $row)
          (i32.add (local.get $c) (i32.shl (i32.add (i32.mul (local.get $i) (local.get $n)) (local.get $j)) (i32.const 2)))
          (local.get $row) (local.get $k))
        (local.set $j (i32.add (local.get $j) (i32.const 8)))
        (br $wide)))
      (if (i32.lt_u (local.get $j) (local.get $n4))
        (then
          (call $tile4x4
            (i32.add (local.get $a) (i32.mul (local.get $i) (local.get $arow))) (local.get $arow) (local.get $astep)
            (i32.add (local.get $b) (i32.shl (local.get $j) (i32.const 2))) (local.get $row)
            (i32.add (local.get $c) (i32.shl (i32.add (i32.mul (local.get $i) (local.get $n)) (local.get $j)) (i32.const 2)))
            (local.get $row) (local.get $k))))
      (local.set $i (i32.add (local.get $i) (i32.const 4)))
      (br $blockRows)))
    ;; The edges element by element: the last n − n4 columns of the first m4 rows, then all of the last rows.
    (local.set $i (i32.const 0))
    (block $edgeDone (loop $edgeRows
      (br_if $edgeDone (i32.ge_u (local.get $i) (local.get $m)))
      (local.set $j (select (local.get $n4) (i32.const 0) (i32.lt_u (local.get $i) (local.get $m4))))
      (block $colsDone (loop $cols
        (br_if $colsDone (i32.ge_u (local.get $j) (local.get $n)))
        (call $dot
          (i32.add (local.get $a) (i32.mul (local.get $i) (local.get $arow))) (local.get $astep)
          (i32.add (local.get $b) (i32.shl (local.get $j) (i32.const 2))) (local.get $row)
          (i32.add (local.get $c) (i32.shl (i32.add (i32.mul (local.get $i) (local.get $n)) (local.get $j)) (i32.const 2)))
          (local.get $k))
        (local.set $j (i32.add (local.get $j) (i32.const 1)))
        (br $cols)))
      (local.set $i (i32.add (local.get $i) (i32.const 1)))
      (br $edgeRows)))))

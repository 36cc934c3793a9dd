export default entityDeleteRoute('stockTubes')

export default entityDeleteRoute('jobs')
